import { and, eq } from 'drizzle-orm'
import { yardMembers, adviceRequests, pledges } from '../database/schema'
import type { AccountRow, YardRow } from '../database/schema'

export type YardAccess = 'view' | 'edit' | 'owner'

/**
 * What a user may do with a yard: the one place that decides. Owners own; members are viewers or editors
 * (shared by invite, or an advisor assigned to an open request). Anyone else gets null.
 */
export async function yardAccessLevel(user: AccountRow, yard: YardRow): Promise<YardAccess | null> {
  if (yard.ownerId === user.id) return 'owner'
  const [member] = await useDb().select({ role: yardMembers.role }).from(yardMembers)
    .where(and(eq(yardMembers.yardId, yard.id), eq(yardMembers.userId, user.id))).limit(1)
  if (member?.role === 'editor') return 'edit'
  // an advisor assigned to a request edits the yard until the request is closed
  const [assigned] = await useDb().select({ id: adviceRequests.id }).from(adviceRequests)
    .where(and(eq(adviceRequests.yardId, yard.id), eq(adviceRequests.advisorId, user.id), eq(adviceRequests.status, 'assigned'))).limit(1)
  if (assigned) return 'edit'
  if (member) return 'view'
  // coordinators look at (never change) every pledged yard
  if (user.role === 'coordinator') {
    const [pledged] = await useDb().select({ id: pledges.id }).from(pledges).where(eq(pledges.yardId, yard.id)).limit(1)
    if (pledged) return 'view'
  }
  return null
}
