// Sets the packets of one lot in the cart (0 takes it out).
import { cartItemBody } from '#shared/schemas/sale'
import { setCartItem } from '../../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, cartItemBody)
  const user = await requireRole(event, 'homeowner', 'coordinator')
  return { cart: await setCartItem(user, body.lotId, body.quantity) }
})
