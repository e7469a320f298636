// The owner undid the edit that accepted a recommendation: it goes back to proposed.
import { idParam } from '#shared/schemas/common'
import { reopenRecommendation } from '../../../services/recommendations'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  await requireUser(event)
  return reopenRecommendation(event, id)
})
