import type { H3Event } from 'h3'
import { eq } from 'drizzle-orm'
import type { Role } from '#shared/types/roles'
import { users, yards, type AccountRow } from '../database/schema'
import { yardAccessLevel, type YardAccess } from '../services/yard-access'

/**
 * The signed-in user, re-read from the database so that a role change or a deleted account takes effect at once.
 * 401 when nobody is signed in (or the account is gone).
 */
export async function requireUser(event: H3Event): Promise<AccountRow> {
  if (event.context.account) return event.context.account as AccountRow
  const id = (await getUserSession(event)).user?.id
  if (!id) throw createError({ status: 401, message: 'Please sign in' })
  const [row] = await useDb().select().from(users).where(eq(users.id, id)).limit(1)
  if (!row) {
    await clearUserSession(event)
    throw createError({ status: 401, message: 'Please sign in' })
  }
  event.context.account = row
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
