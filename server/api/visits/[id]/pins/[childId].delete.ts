// Remove a pin from a visit.
import { visitChildParam } from '#shared/schemas/advice'
import { deletePin } from '../../../../services/advice'

export default defineEventHandler(async (event) => {
  const { id, childId } = readParamsWith(event, visitChildParam)
  const user = await requireUser(event)
  await deletePin(user, id, childId)
  setResponseStatus(event, 204)
  return null
})
