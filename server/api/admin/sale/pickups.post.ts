// A pickup event (date, time, place) for a sale.
import { eq } from 'drizzle-orm'
import { pickupEventBody } from '#shared/schemas/sale'
import { pickupEvents } from '../../../database/schema'
import { saleById } from '../../../services/sale'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, pickupEventBody)
  await requireRole(event, 'coordinator')
  await saleById(body.saleId)
  const id = insertedId(await useDb().insert(pickupEvents).values({ saleId: body.saleId, place: body.place, startsAt: body.startsAt.replace('T', ' ') + ':00' }).$returningId())
  setResponseStatus(event, 201)
  return (await useDb().select().from(pickupEvents).where(eq(pickupEvents.id, id)))[0]
})
