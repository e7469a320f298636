// A new sale (dates, mail fee, paused or not).
import { saleBody } from '#shared/schemas/sale'
import { createSale } from '../../../services/sale'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, saleBody)
  await requireRole(event, 'coordinator')
  setResponseStatus(event, 201)
  return createSale(body)
})
