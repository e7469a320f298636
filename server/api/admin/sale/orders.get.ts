// The coordinator's orders table, filtered by status, pickup and paid or not.
import { adminOrdersQuery } from '#shared/schemas/sale'
import { adminOrders } from '../../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const q = readQueryWith(event, adminOrdersQuery)
  await requireRole(event, 'coordinator')
  return { orders: await adminOrders(q) }
})
