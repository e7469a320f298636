// Revoke an invitation (and the access it gave), the owner only.
import { yardInviteParam } from '#shared/schemas/advice'
import { revokeInvite } from '../../../../services/sharing'

export default defineEventHandler(async (event) => {
  const { id, inviteId } = readParamsWith(event, yardInviteParam)
  await requireYardAccess(event, id, 'owner')
  await revokeInvite(id, inviteId)
  setResponseStatus(event, 204)
  return null
})
