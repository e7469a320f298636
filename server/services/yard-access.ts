import { and, eq } from 'drizzle-orm'
import { yardMembers } from '../database/schema'
import type { AccountRow, YardRow } from '../utils/auth'

export type YardAccess = 'view' | 'edit' | 'owner'

/**
 * What a user may do with a yard: the one place that decides. Owners own; members are viewers or editors
 * (shared by invite, or an advisor assigned to an open request). Anyone else gets null.
 */
export async function yardAccessLevel(user: AccountRow, yard: YardRow): Promise<YardAccess | null> {
  if (yard.ownerId === user.id) return 'owner'
  const [member] = await useDb().select({ role: yardMembers.role }).from(yardMembers)
    .where(and(eq(yardMembers.yardId, yard.id), eq(yardMembers.userId, user.id))).limit(1)
  if (member) return member.role === 'editor' ? 'edit' : 'view'
  return null
}
