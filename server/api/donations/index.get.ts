// The signed-in person's own donations.
import { myDonations } from '../../services/donations'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  return { donations: await myDonations(user) }
})
