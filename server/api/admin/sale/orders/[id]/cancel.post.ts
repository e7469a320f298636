// Cancels an order; a card payment is refunded through the payment service.
import { idParam } from '#shared/schemas/common'
import { cancelOrder } from '../../../../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  await requireRole(event, 'coordinator')
  return cancelOrder(id)
})
