// A new seed lot in a sale.
import { lotBody } from '#shared/schemas/sale'
import { createLot } from '../../../services/sale'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, lotBody)
  await requireRole(event, 'coordinator')
  setResponseStatus(event, 201)
  return createLot(body)
})
