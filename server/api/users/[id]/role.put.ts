// Coordinators: change an account's role. A coordinator cannot demote themselves (the organisation keeps one).
import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { changeRoleBody } from '#shared/schemas/auth'
import { users } from '../../../database/schema'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { role } = await readBodyWith(event, changeRoleBody)
  const me = await requireRole(event, 'coordinator')
  if (me.id === id && role !== 'coordinator') throw createError({ status: 400, message: 'You cannot remove your own coordinator role', data: { fields: { role: 'Ask another coordinator to do this' } } })
  const db = useDb()
  const [result] = await db.update(users).set({ role }).where(eq(users.id, id))
  if (result.affectedRows === 0) throw createError({ status: 404, message: 'No such user' })
  const [u] = await db.select({ id: users.id, email: users.email, name: users.name, role: users.role }).from(users).where(eq(users.id, id))
  return u
})
