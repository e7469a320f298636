// The catalogue (or a filtered view) as CSV, in the same columns the import reads.
import { exportQuery } from '#shared/schemas/species'
import { exportCsv } from '../../services/catalogue'

export default defineEventHandler(async (event) => {
  const q = readQueryWith(event, exportQuery)
  await requireRole(event, 'coordinator')
  const csv = await exportCsv(q)
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="wildward-species${q.region ? `-${q.region}` : ''}.csv"`)
  return csv
})
