// Delete a yard (its owner only); members and history go with it.
import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { yards } from '../../database/schema'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  await requireYardAccess(event, id, 'owner')
  await useDb().delete(yards).where(eq(yards.id, id))
  setResponseStatus(event, 204)
  return null
})
