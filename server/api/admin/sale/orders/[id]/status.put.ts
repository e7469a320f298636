// Marks an order packed, picked up or sent.
import { idParam } from '#shared/schemas/common'
import { orderStatusBody } from '#shared/schemas/sale'
import { setOrderStatus } from '../../../../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, orderStatusBody)
  await requireRole(event, 'coordinator')
  return setOrderStatus(id, body.status)
})
