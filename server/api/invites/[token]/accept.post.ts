// Accept an invitation as the signed-in account it was sent to.
import { inviteTokenParam } from '#shared/schemas/advice'
import { acceptInvite } from '../../../services/sharing'

export default defineEventHandler(async (event) => {
  const { token } = readParamsWith(event, inviteTokenParam)
  const user = await requireUser(event)
  return acceptInvite(user, token)
})
