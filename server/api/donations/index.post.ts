// Starts a donation through the hosted checkout; the amount is the giver's, checked here.
import { donationBody } from '#shared/schemas/sale'
import { startDonation } from '../../services/donations'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, donationBody)
  const user = await requireUser(event)
  setResponseStatus(event, 201)
  return startDonation(user, body)
})
