// Sharing a yard by e-mail invite: the link carries a random token (only its hash is stored); accepting adds a
// yard_members row with the invited role, revoking removes it.
import { and, eq, gt, isNull, desc, sql } from 'drizzle-orm'
import { createHash, randomBytes } from 'node:crypto'
import { users, yards, yardMembers, yardInvites } from '../database/schema'
import type { AccountRow, YardRow } from '../database/schema'

const INVITE_TTL_MS = 30 * 24 * 60 * 60 * 1000
const sha256 = (s: string) => createHash('sha256').update(s).digest('hex')
type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]

export async function createInvite(owner: AccountRow, yard: YardRow, input: { email: string; role: 'viewer' | 'editor' }) {
  if (input.email === owner.email) throw createError({ status: 400, message: 'You own this yard already', data: { fields: { email: 'That is your own address' } } })
  const db = useDb()
  const token = randomBytes(32).toString('base64url')
  const id = insertedId(await db.insert(yardInvites).values({
    yardId: yard.id, email: input.email, role: input.role, tokenHash: sha256(token), invitedBy: owner.id,
    expiresAt: new Date(Date.now() + INVITE_TTL_MS),
  }).$returningId())
  const [account] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1)
  // someone without an account registers from the link; the invite is accepted with the new account
  const link = account
    ? appLink(`/invites/${encodeURIComponent(token)}`)
    : appLink(`/register?invite=${encodeURIComponent(token)}&email=${encodeURIComponent(input.email)}&next=${encodeURIComponent(`/invites/${token}`)}`)
  await sendMail({
    to: input.email,
    subject: `${owner.name} shared a yard with you on Wildward`,
    text: `Hello,\n\n${owner.name} invited you to ${input.role === 'editor' ? 'help edit' : 'look at'} the yard plan "${yard.name}" on Wildward.\n\n`
      + `${account ? 'Open this link to accept:' : 'Create a free account from this link to accept:'}\n\n${link}\n\n`
      + 'The invitation is valid for 30 days. If you were not expecting it, ignore this e-mail.\n',
  })
  return { id, token }
}

/** Who has the yard: accepted and pending invites, and members added any other way. */
export async function listShares(yardId: number) {
  const db = useDb()
  const invites = await db.select({
    id: yardInvites.id, email: yardInvites.email, role: yardInvites.role, acceptedAt: yardInvites.acceptedAt,
    expiresAt: yardInvites.expiresAt, createdAt: yardInvites.createdAt, acceptedBy: yardInvites.acceptedBy,
  }).from(yardInvites).where(and(eq(yardInvites.yardId, yardId), isNull(yardInvites.revokedAt))).orderBy(desc(yardInvites.createdAt))
  const members = await db.select({ userId: yardMembers.userId, role: yardMembers.role, name: users.name, email: users.email, since: yardMembers.createdAt })
    .from(yardMembers).innerJoin(users, eq(users.id, yardMembers.userId)).where(eq(yardMembers.yardId, yardId))
  const now = Date.now()
  return {
    invites: invites.map((i) => ({
      id: i.id, email: i.email, role: i.role, createdAt: i.createdAt,
      status: i.acceptedAt ? 'accepted' : i.expiresAt.getTime() < now ? 'expired' : 'pending',
    })),
    members,
  }
}

/** Revokes an invite; when it was accepted, the member it made loses access too. */
export async function revokeInvite(yardId: number, inviteId: number) {
  await useDb().transaction(async (tx) => {
    const [invite] = await tx.select().from(yardInvites).where(and(eq(yardInvites.id, inviteId), eq(yardInvites.yardId, yardId), isNull(yardInvites.revokedAt))).for('update')
    if (!invite) throw createError({ status: 404, message: 'No such invitation' })
    await tx.update(yardInvites).set({ revokedAt: new Date() }).where(eq(yardInvites.id, invite.id))
    if (invite.acceptedBy) await removeMember(tx, yardId, invite.acceptedBy)
  })
}

export async function revokeMember(yardId: number, userId: number) {
  await useDb().transaction(async (tx) => {
    const removed = await removeMember(tx, yardId, userId)
    if (!removed) throw createError({ status: 404, message: 'That person does not share this yard' })
  })
}

async function removeMember(tx: Tx, yardId: number, userId: number) {
  const [r] = await tx.delete(yardMembers).where(and(eq(yardMembers.yardId, yardId), eq(yardMembers.userId, userId)))
  // an accepted invite for the same person goes with it, so the link cannot be replayed
  await tx.update(yardInvites).set({ revokedAt: new Date() }).where(and(eq(yardInvites.yardId, yardId), eq(yardInvites.acceptedBy, userId), isNull(yardInvites.revokedAt)))
  return r.affectedRows > 0
}

async function findInvite(db: Db | Tx, token: string, lock = false) {
  const q = db.select({ invite: yardInvites, yardName: yards.name, ownerId: yards.ownerId, inviterName: users.name })
    .from(yardInvites).innerJoin(yards, eq(yards.id, yardInvites.yardId)).innerJoin(users, eq(users.id, yardInvites.invitedBy))
    .where(eq(yardInvites.tokenHash, sha256(token))).limit(1)
  const [row] = lock ? await q.for('update') : await q
  return row
}

/** What the link shows before accepting: the yard's name and who invited, nothing about the owner's other data. */
export async function describeInvite(token: string) {
  const row = await findInvite(useDb(), token)
  if (!row || row.invite.revokedAt) throw createError({ status: 404, message: 'This invitation was withdrawn or does not exist' })
  const expired = row.invite.expiresAt.getTime() < Date.now()
  return {
    yardName: row.yardName, inviterName: row.inviterName, role: row.invite.role, email: row.invite.email,
    status: row.invite.acceptedAt ? 'accepted' : expired ? 'expired' : 'pending',
    yardId: row.invite.acceptedAt ? row.invite.yardId : null,
  }
}

/** Accepts for `user` (whose e-mail must be the invited one, so a forwarded link does not share the yard). */
export async function acceptInvite(user: Pick<AccountRow, 'id' | 'email'>, token: string, tx?: Tx) {
  const work = async (t: Tx) => {
    const row = await findInvite(t, token, true)
    if (!row || row.invite.revokedAt) throw createError({ status: 404, message: 'This invitation was withdrawn or does not exist', data: { fields: { invite: 'Withdrawn or unknown' } } })
    const { invite } = row
    if (invite.acceptedAt) {
      if (invite.acceptedBy === user.id) return { yardId: invite.yardId }
      throw createError({ status: 409, message: 'This invitation was already used', data: { fields: { invite: 'Already used' } } })
    }
    if (invite.expiresAt.getTime() < Date.now()) throw createError({ status: 410, message: 'This invitation has expired: ask for a new one', data: { fields: { invite: 'Expired' } } })
    if (invite.email !== user.email) throw createError({ status: 403, message: `This invitation is for ${invite.email}: sign in with that address`, data: { fields: { invite: 'For another address' } } })
    if (row.ownerId !== user.id) {
      // an existing membership keeps the higher of the two roles
      await t.insert(yardMembers).values({ yardId: invite.yardId, userId: user.id, role: invite.role })
        .onDuplicateKeyUpdate({ set: { role: invite.role === 'editor' ? 'editor' : sql`role` } })
    }
    await t.update(yardInvites).set({ acceptedAt: new Date(), acceptedBy: user.id }).where(and(eq(yardInvites.id, invite.id), gt(yardInvites.expiresAt, new Date())))
    return { yardId: invite.yardId }
  }
  return tx ? work(tx) : useDb().transaction(work)
}
