import type { H3Event } from 'h3'
import { and, eq, gt, isNull, sql } from 'drizzle-orm'
import { createHash, randomBytes } from 'node:crypto'
import { users, passwordResetTokens, loginAttempts, sessions, type AccountRow } from '../database/schema'
import { acceptInvite } from './sharing'
import { enqueueJob } from './jobs'
import { openSession, endSession, endOtherSessions, sessionToken } from './sessions'

const THROTTLE_WINDOW_MS = 15 * 60 * 1000
const RESET_TOKEN_TTL_MS = 60 * 60 * 1000

export function publicUser(u: AccountRow) {
  return { id: u.id, email: u.email, name: u.name, role: u.role }
}

/** Opens a session row and seals its token into the cookie (replacing any earlier session of this browser). */
export async function startSession(event: H3Event, u: AccountRow) {
  const previous = await sessionToken(event).catch(() => undefined)
  if (previous) await endSession(previous)
  const token = await openSession(u.id)
  await replaceUserSession(event, { user: publicUser(u), secure: { token }, loggedInAt: Date.now() })
}

export function clientAddress(event: H3Event): string {
  // X-Forwarded-For is trusted only behind a known proxy (NUXT_TRUST_PROXY), else anyone could dodge the throttle;
  // its last entry is the one our proxy added (earlier ones are whatever the client sent)
  const forwarded = useRuntimeConfig().trustProxy ? getRequestHeader(event, 'x-forwarded-for') : undefined
  const lastHop = forwarded?.split(',').map((a) => a.trim()).filter(Boolean).at(-1)
  return (lastHop ?? getRequestIP(event) ?? 'unknown').slice(0, 64)
}

const throttleKey = (...parts: string[]) => createHash('sha256').update(parts.join('\u0000')).digest('hex')

/**
 * Counts one attempt against a throttle key and returns the count in the current window, atomically: the upsert
 * locks the row, so parallel attempts each get their own number.
 */
async function countAttempt(tx: Parameters<Parameters<ReturnType<typeof useDb>['transaction']>[0]>[0], key: string): Promise<number> {
  const fresh = sql`${loginAttempts.windowStart} < now(3) - interval ${THROTTLE_WINDOW_MS / 1000} second`
  await tx.insert(loginAttempts).values({ keyHash: key, attempts: 1 }).onDuplicateKeyUpdate({
    set: {
      // attempts is assigned first and still sees the old window_start; window_start then restarts an old window
      attempts: sql`if(${fresh}, 1, ${loginAttempts.attempts} + 1)`,
      windowStart: sql`if(${fresh}, now(3), ${loginAttempts.windowStart})`,
    },
  })
  const [row] = await tx.select({ n: loginAttempts.attempts }).from(loginAttempts).where(eq(loginAttempts.keyHash, key))
  return row?.n ?? 1
}

/**
 * Reserves a sign-in attempt before the password is checked, or answers 429. The limit per e-mail applies to
 * each address on its own (an address that has not failed is never refused the right password, OWASP ASVS 4.0
 * 2.2.1); an address also has an overall limit across e-mails. A success gives both reservations back.
 */
async function reserveAttempt(event: H3Event, email: string, address: string) {
  const cfg = useRuntimeConfig()
  const pairKey = throttleKey('pair', email, address)
  const addressKey = throttleKey('address', address)
  const [pair, byAddress] = await useDb().transaction(async (tx) => [await countAttempt(tx, pairKey), await countAttempt(tx, addressKey)])
  if (pair > Number(cfg.loginThrottlePerEmail) || byAddress > Number(cfg.loginThrottlePerAddress)) {
    setResponseHeader(event, 'Retry-After', THROTTLE_WINDOW_MS / 1000)
    throw createError({ status: 429, message: 'Too many failed sign-ins from here. Please wait 15 minutes, or reset your password.' })
  }
  return { pairKey, addressKey }
}

export async function signIn(event: H3Event, email: string, password: string): Promise<AccountRow> {
  const address = clientAddress(event)
  const { pairKey, addressKey } = await reserveAttempt(event, email, address)
  const db = useDb()
  const [u] = await db.select().from(users).where(eq(users.email, email)).limit(1)
  // verify against a dummy hash when the account does not exist, so timing does not reveal which e-mails exist
  const ok = u ? await verifyPassword(u.passwordHash, password) : (await hashPassword(password), false)
  if (!u || !ok) {
    throw createError({ status: 401, message: 'That e-mail and password do not match an account', data: { fields: { password: 'E-mail or password is wrong' } } })
  }
  // a success clears this pair's count and takes its attempt off the address's
  await db.delete(loginAttempts).where(eq(loginAttempts.keyHash, pairKey))
  await db.update(loginAttempts).set({ attempts: sql`greatest(${loginAttempts.attempts} - 1, 0)` }).where(eq(loginAttempts.keyHash, addressKey))
  return u
}

export async function register(input: { email: string; name: string; password: string; invite?: string }): Promise<AccountRow> {
  const db = useDb()
  const taken = () => createError({ status: 409, message: 'An account with that e-mail already exists', data: { fields: { email: 'An account with that e-mail already exists — sign in or reset the password' } } })
  const [existing] = await db.select({ id: users.id }).from(users).where(eq(users.email, input.email)).limit(1)
  if (existing) throw taken()
  const passwordHash = await hashPassword(input.password)
  // the unique key decides a race between two registrations of one e-mail
  const id = await db.insert(users).values({ email: input.email, name: input.name, passwordHash }).$returningId()
    .then(insertedId, (e) => { throw isDuplicateKey(e) ? taken() : e })
  const [u] = await db.select().from(users).where(eq(users.id, id))
  // registering from an invitation link accepts it; a stale or foreign link still leaves a working account
  if (input.invite) await acceptInvite(u!, input.invite).catch(() => undefined)
  return u!
}

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex')

export const PASSWORD_RESET_JOB = 'password-reset'

/**
 * Queues a reset mail for an e-mail: the request does the same single insert whether or not an account uses it,
 * so neither its answer nor its timing tells. One job per e-mail per minute.
 */
export async function requestPasswordReset(email: string) {
  const minute = Math.floor(Date.now() / 60_000)
  await enqueueJob(PASSWORD_RESET_JOB, { email }, new Date(), `${PASSWORD_RESET_JOB}:${sha256(email)}:${minute}`)
}

/** The job: mails a single-use reset link when the account exists. */
export async function sendPasswordReset({ email }: { email: string }) {
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
    // a reset ends every session of the account (the caller opens a new one)
    await tx.delete(sessions).where(eq(sessions.userId, row.userId))
    const [u] = await tx.select().from(users).where(eq(users.id, row.userId))
    return u!
  })
}

/** Changes the password and ends the account's other sessions (the one making the change stays signed in). */
export async function changePassword(event: H3Event, u: AccountRow, current: string, next: string) {
  if (!(await verifyPassword(u.passwordHash, current))) {
    throw createError({ status: 400, message: 'The current password is wrong', data: { fields: { currentPassword: 'This is not your current password' } } })
  }
  await useDb().update(users).set({ passwordHash: await hashPassword(next) }).where(eq(users.id, u.id))
  await endOtherSessions(u.id, await sessionToken(event))
}
