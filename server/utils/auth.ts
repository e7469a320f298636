import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import type { Role } from '#shared/types/roles'
import { yards, type AccountRow } from '../database/schema'
import { yardAccessLevel, type YardAccess } from '../services/yard-access'
import { liveSessionUser } from '../services/sessions'

// Unsealing the session cookie costs a few milliseconds of key derivation on every request, so each instance
// remembers, briefly, which session token an exact sealed cookie value holds. The sealed string never changes
// meaning; whether the session is still live is asked of the database on every request.
const SESSION_MEMO_MS = 30_000
const SESSION_MEMO_MAX = 10_000
const sessionMemo = new Map<string, { token: string; userId: number; until: number }>()

async function sealedSession(event: H3Event): Promise<{ token: string; userId: number } | undefined> {
  const raw = getCookie(event, useRuntimeConfig().session.name || 'nuxt-session')
  if (!raw) return undefined
  const now = Date.now()
  const hit = sessionMemo.get(raw)
  if (hit && hit.until > now) return hit
  const session = await getUserSession(event)
  const token = session.secure?.token
  const userId = session.user?.id
  if (!token || !userId) return undefined
  if (sessionMemo.size >= SESSION_MEMO_MAX) sessionMemo.delete(sessionMemo.keys().next().value!)
  sessionMemo.set(raw, { token, userId, until: now + SESSION_MEMO_MS })
  return { token, userId }
}

/** The account of this request's live session (ended, idle or too old sessions count as none). */
async function sessionAccount(event: H3Event): Promise<AccountRow | undefined> {
  if (event.context.account) return event.context.account as AccountRow
  const sealed = await sealedSession(event)
  const row = sealed ? await liveSessionUser(sealed.token) : undefined
  if (row) event.context.account = row
  return row
}

/**
 * The signed-in user, re-read from the database with the session so that a role change, a sign-out elsewhere
 * or a password change takes effect at once. 401 when nobody is signed in (or the session ended).
 */
export async function requireUser(event: H3Event): Promise<AccountRow> {
  const row = await sessionAccount(event)
  if (!row) throw createError({ status: 401, message: 'Please sign in' })
  return row
}

/** The signed-in user when they hold one of `roles`; 403 otherwise. */
export async function requireRole(event: H3Event, ...roles: Role[]): Promise<AccountRow> {
  const user = await requireUser(event)
  if (!roles.includes(user.role)) throw createError({ status: 403, message: `Only a ${roles.join(' or ')} may do this` })
  return user
}

const RANK: Record<YardAccess, number> = { view: 1, edit: 2, owner: 3 }

/**
 * The yard and the user's access to it, when it is at least `need`. A yard the user may not see at all answers
 * 404 (its existence is not revealed); one they may see but not change answers 403.
 */
export async function requireYardAccess(event: H3Event, yardId: number, need: YardAccess) {
  const user = await requireUser(event)
  const [yard] = await useDb().select().from(yards).where(eq(yards.id, yardId)).limit(1)
  const access = yard ? await yardAccessLevel(user, yard) : null
  if (!yard || !access) throw createError({ status: 404, message: 'No such yard' })
  if (RANK[access] < RANK[need]) throw createError({ status: 403, message: need === 'owner' ? 'Only the owner of this yard may do this' : 'You may view this yard but not change it' })
  return { user, yard, access }
}
