// The owner declines a recommendation, with a word on why.
import { idParam } from '#shared/schemas/common'
import { declineBody } from '#shared/schemas/advice'
import { declineRecommendation } from '../../../services/recommendations'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { reason } = await readBodyWith(event, declineBody)
  const user = await requireUser(event)
  return declineRecommendation(event, user, id, reason)
})
