// The signed-in person's own orders.
import { myOrders } from '../../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'homeowner', 'coordinator')
  return { orders: await myOrders(user) }
})
