// The orders table as CSV, with the same filters.
import { adminOrdersQuery } from '#shared/schemas/sale'
import { ordersCsv } from '../../../../services/sale-report'

export default defineEventHandler(async (event) => {
  const q = readQueryWith(event, adminOrdersQuery)
  await requireRole(event, 'coordinator')
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', 'attachment; filename="seed-orders.csv"')
  return ordersCsv(q)
})
