import type { H3Event } from 'h3'
import { and, eq, gt, isNull, sql, count } from 'drizzle-orm'
import { createHash, randomBytes } from 'node:crypto'
import { users, passwordResetTokens, loginFailures } from '../database/schema'
import type { AccountRow } from '../database/schema'
import { acceptInvite } from './sharing'

const THROTTLE_WINDOW_MS = 15 * 60 * 1000
const RESET_TOKEN_TTL_MS = 60 * 60 * 1000

export function publicUser(u: AccountRow) {
  return { id: u.id, email: u.email, name: u.name, role: u.role }
}

export async function startSession(event: H3Event, u: AccountRow) {
  await replaceUserSession(event, { user: publicUser(u), loggedInAt: Date.now() })
}

export function clientAddress(event: H3Event): string {
  // X-Forwarded-For is trusted only behind a known proxy (NUXT_TRUST_PROXY), else anyone could dodge the throttle
  return (getRequestIP(event, { xForwardedFor: !!useRuntimeConfig().trustProxy }) ?? 'unknown').slice(0, 64)
}

/** 429 when this e-mail or this address has failed too often in the last 15 minutes. */
async function assertNotThrottled(event: H3Event, email: string, address: string) {
  const cfg = useRuntimeConfig()
  const since = new Date(Date.now() - THROTTLE_WINDOW_MS)
  const db = useDb()
  const [byEmail] = await db.select({ n: count() }).from(loginFailures).where(and(eq(loginFailures.email, email), gt(loginFailures.at, since)))
  const [byAddress] = await db.select({ n: count() }).from(loginFailures).where(and(eq(loginFailures.address, address), gt(loginFailures.at, since)))
  if ((byEmail?.n ?? 0) >= Number(cfg.loginThrottlePerEmail) || (byAddress?.n ?? 0) >= Number(cfg.loginThrottlePerAddress)) {
    setResponseHeader(event, 'Retry-After', THROTTLE_WINDOW_MS / 1000)
    throw createError({ status: 429, message: 'Too many failed sign-ins. Please wait 15 minutes, or reset your password.' })
  }
}

export async function signIn(event: H3Event, email: string, password: string): Promise<AccountRow> {
  const address = clientAddress(event)
  await assertNotThrottled(event, email, address)
  const db = useDb()
  const [u] = await db.select().from(users).where(eq(users.email, email)).limit(1)
  // verify against a dummy hash when the account does not exist, so timing does not reveal which e-mails exist
  const ok = u ? await verifyPassword(u.passwordHash, password) : (await hashPassword(password), false)
  if (!u || !ok) {
    await db.insert(loginFailures).values({ email, address })
    throw createError({ status: 401, message: 'That e-mail and password do not match an account', data: { fields: { password: 'E-mail or password is wrong' } } })
  }
  // a success clears this e-mail's failures
  await db.delete(loginFailures).where(eq(loginFailures.email, email))
  return u
}

export async function register(input: { email: string; name: string; password: string; invite?: string }): Promise<AccountRow> {
  const db = useDb()
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1)
  if (existing) throw createError({ status: 409, message: 'An account with that e-mail already exists', data: { fields: { email: 'An account with that e-mail already exists — sign in or reset the password' } } })
  const passwordHash = await hashPassword(input.password)
  const id = insertedId(await db.insert(users).values({ email: input.email, name: input.name, passwordHash }).$returningId())
  const [u] = await db.select().from(users).where(eq(users.id, id))
  // registering from an invitation link accepts it; a stale or foreign link still leaves a working account
  if (input.invite) await acceptInvite(u!, input.invite).catch(() => undefined)
  return u!
}

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex')

/** Mails a single-use reset link when the account exists; answers the same either way. */
export async function requestPasswordReset(email: string) {
  const db = useDb()
  const [u] = await db.select().from(users).where(eq(users.email, email)).limit(1)
  if (!u) return
  const token = randomBytes(32).toString('base64url')
  await db.insert(passwordResetTokens).values({ userId: u.id, tokenHash: sha256(token), expiresAt: new Date(Date.now() + RESET_TOKEN_TTL_MS) })
  const link = appLink(`/reset-password?token=${encodeURIComponent(token)}`)
  await sendMail({
    to: u.email,
    subject: 'Reset your Wildward password',
    text: `Hello ${u.name},\n\nSomeone (we hope you) asked to reset the password of your Wildward account.\nOpen this link within an hour to choose a new one:\n\n${link}\n\nIf it was not you, ignore this e-mail: your password stays as it is.\n`,
  })
}

export async function resetPassword(token: string, password: string): Promise<AccountRow> {
  const db = useDb()
  return db.transaction(async (tx) => {
    const [row] = await tx.select().from(passwordResetTokens)
      .where(and(eq(passwordResetTokens.tokenHash, sha256(token)), isNull(passwordResetTokens.usedAt), gt(passwordResetTokens.expiresAt, new Date())))
      .for('update').limit(1)
    if (!row) throw createError({ status: 400, message: 'This reset link has expired or was already used. Ask for a new one.', data: { fields: { token: 'Expired or already used' } } })
    await tx.update(passwordResetTokens).set({ usedAt: new Date() }).where(eq(passwordResetTokens.id, row.id))
    // one reset invalidates every other outstanding link for the account
    await tx.update(passwordResetTokens).set({ usedAt: sql`now(3)` }).where(and(eq(passwordResetTokens.userId, row.userId), isNull(passwordResetTokens.usedAt)))
    await tx.update(users).set({ passwordHash: await hashPassword(password) }).where(eq(users.id, row.userId))
    await tx.delete(loginFailures).where(eq(loginFailures.email, sql`(select email from users where id = ${row.userId})`))
    const [u] = await tx.select().from(users).where(eq(users.id, row.userId))
    return u!
  })
}

export async function changePassword(u: AccountRow, current: string, next: string) {
  if (!(await verifyPassword(u.passwordHash, current))) {
    throw createError({ status: 400, message: 'The current password is wrong', data: { fields: { currentPassword: 'This is not your current password' } } })
  }
  await useDb().update(users).set({ passwordHash: await hashPassword(next) }).where(eq(users.id, u.id))
}
