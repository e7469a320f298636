// One advice request with its visits, for the coordinator, the requester and the assigned advisor.
import { idParam } from '#shared/schemas/common'
import { requestDetails } from '../../services/advice'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const user = await requireUser(event)
  return requestDetails(user, id)
})
