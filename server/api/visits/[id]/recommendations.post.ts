// Record a recommendation (a structured change) with its predicted effect on the three shares.
import { idParam } from '#shared/schemas/common'
import { recommendationBody } from '#shared/schemas/advice'
import { createRecommendation } from '../../../services/recommendations'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { change } = await readBodyWith(event, recommendationBody)
  const user = await requireUser(event)
  setResponseStatus(event, 201)
  return createRecommendation(user, id, change)
})
