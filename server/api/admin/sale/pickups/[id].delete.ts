// Removes a pickup event that no order has chosen.
import { eq } from 'drizzle-orm'
import { idParam } from '#shared/schemas/common'
import { pickupEvents, saleOrders } from '../../../../database/schema'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  await requireRole(event, 'coordinator')
  const [used] = await useDb().select({ id: saleOrders.id }).from(saleOrders).where(eq(saleOrders.pickupEventId, id)).limit(1)
  if (used) throw invalidInput({ pickupEventId: 'Orders are booked for this pickup' }, 'Orders are booked for this pickup; it cannot be removed', 409)
  const [r] = await useDb().delete(pickupEvents).where(eq(pickupEvents.id, id))
  if (!r.affectedRows) throw createError({ status: 404, message: 'No such pickup' })
  return { deleted: id }
})
