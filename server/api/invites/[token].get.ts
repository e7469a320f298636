// What an invitation link is for (yard name, who invited, role), for whoever holds the link.
import { inviteTokenParam } from '#shared/schemas/advice'
import { describeInvite } from '../../services/sharing'

export default defineEventHandler(async (event) => {
  const { token } = readParamsWith(event, inviteTokenParam)
  return describeInvite(token)
})
