// Sessions that end on the server: the sealed cookie (nuxt-auth-utils) carries a random token; the sessions
// table holds its hash, the account, when it began and when it was last used.
import type { H3Event } from 'h3'
import { and, eq, gt, lt, ne, or, sql } from 'drizzle-orm'
import { createHash, randomBytes } from 'node:crypto'
import { sessions, users } from '../database/schema'

const sha256 = (s: string) => createHash('sha256').update(s).digest('hex')
// last_seen_at is written at most this often per session, not on every request
const TOUCH_EVERY_S = 60

export function sessionLimits() {
  const cfg = useRuntimeConfig()
  return { idleS: Number(cfg.sessionIdleSeconds), absoluteS: Number(cfg.session.maxAge) }
}

/** Opens a session row for the user and returns the token to seal into the cookie. */
export async function openSession(userId: number): Promise<string> {
  const token = randomBytes(32).toString('base64url')
  const { idleS, absoluteS } = sessionLimits()
  const db = useDb()
  // the user's expired rows go as a new one comes, so the table stays the size of live sessions
  await db.delete(sessions).where(and(eq(sessions.userId, userId), or(
    lt(sessions.createdAt, sql`now(3) - interval ${absoluteS} second`),
    lt(sessions.lastSeenAt, sql`now(3) - interval ${idleS} second`),
  )))
  await db.insert(sessions).values({ tokenHash: sha256(token), userId })
  return token
}

/** The live session's account for a token, refreshing its last use; undefined when it ended or expired. */
export async function liveSessionUser(token: string) {
  const { idleS, absoluteS } = sessionLimits()
  const db = useDb()
  const hash = sha256(token)
  const [row] = await db.select({ user: users, lastSeenAt: sessions.lastSeenAt }).from(sessions)
    .innerJoin(users, eq(users.id, sessions.userId))
    .where(and(
      eq(sessions.tokenHash, hash),
      gt(sessions.createdAt, sql`now(3) - interval ${absoluteS} second`),
      gt(sessions.lastSeenAt, sql`now(3) - interval ${idleS} second`),
    )).limit(1)
  if (!row) return undefined
  if (Date.now() - row.lastSeenAt.getTime() > TOUCH_EVERY_S * 1000) {
    await db.update(sessions).set({ lastSeenAt: sql`now(3)` }).where(eq(sessions.tokenHash, hash))
  }
  return row.user
}

export async function endSession(token: string) {
  await useDb().delete(sessions).where(eq(sessions.tokenHash, sha256(token)))
}

/** Ends every session of the user but the one whose token is given (a password change keeps its own). */
export async function endOtherSessions(userId: number, keepToken?: string) {
  const db = useDb()
  await db.delete(sessions).where(keepToken
    ? and(eq(sessions.userId, userId), ne(sessions.tokenHash, sha256(keepToken)))
    : eq(sessions.userId, userId))
}

/** The session token sealed in this request's cookie, if any. */
export async function sessionToken(event: H3Event): Promise<string | undefined> {
  const session = await getUserSession(event)
  return (session.secure as { token?: string } | undefined)?.token
}
