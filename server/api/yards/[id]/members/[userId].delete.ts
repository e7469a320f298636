// Stop sharing a yard with one person, the owner only.
import { yardMemberParam } from '#shared/schemas/advice'
import { revokeMember } from '../../../../services/sharing'

export default defineEventHandler(async (event) => {
  const { id, userId } = readParamsWith(event, yardMemberParam)
  await requireYardAccess(event, id, 'owner')
  await revokeMember(id, userId)
  setResponseStatus(event, 204)
  return null
})
