// Every donation, with totals of those received.
import { allDonations } from '../../../services/donations'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'coordinator')
  return allDonations()
})
