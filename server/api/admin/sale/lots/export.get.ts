// A sale's lots as CSV (the same columns the import reads).
import { z } from 'zod'
import { lotsCsv } from '../../../../services/sale'

const query = z.object({ saleId: z.coerce.number().int().positive() })

export default defineEventHandler(async (event) => {
  const q = readQueryWith(event, query)
  await requireRole(event, 'coordinator')
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="seed-lots-${q.saleId}.csv"`)
  return lotsCsv(q.saleId)
})
