// The signed-in person's cart in the current sale (null when empty).
import { getCart } from '../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'homeowner', 'coordinator')
  return { cart: await getCart(user) }
})
