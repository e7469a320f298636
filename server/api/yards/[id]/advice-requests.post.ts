// Ask the organisation for an advisor's visit to a yard (its owner): a message and preferred times.
import { idParam } from '#shared/schemas/common'
import { adviceRequestBody } from '#shared/schemas/advice'
import { createAdviceRequest } from '../../../services/advice'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, adviceRequestBody)
  const { user, yard } = await requireYardAccess(event, id, 'owner')
  setResponseStatus(event, 201)
  return createAdviceRequest(user, yard, body)
})
