// Donations as CSV.
import { donationsCsv } from '../../../../services/donations'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'coordinator')
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', 'attachment; filename="donations.csv"')
  return donationsCsv()
})
