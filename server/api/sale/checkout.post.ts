// Places the cart: holds its packets, then either the hosted checkout's address or "pay at pickup".
import { checkoutBody } from '#shared/schemas/sale'
import { startCheckout } from '../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, checkoutBody)
  const user = await requireRole(event, 'homeowner', 'coordinator')
  setResponseStatus(event, 201)
  return startCheckout(user, body)
})
