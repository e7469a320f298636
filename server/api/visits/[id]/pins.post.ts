// Pin a comment to a spot on the plan during a visit.
import { idParam } from '#shared/schemas/common'
import { pinBody } from '#shared/schemas/advice'
import { addPin } from '../../../services/advice'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, pinBody)
  const user = await requireUser(event)
  setResponseStatus(event, 201)
  return addPin(user, id, body)
})
