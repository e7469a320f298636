// A yard's advice for anyone who may view it: its requests, the advisors' recommendations and pins.
import { idParam } from '#shared/schemas/common'
import { listYardRequests, yardPins } from '../../../services/advice'
import { listYardRecommendations } from '../../../services/recommendations'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { access } = await requireYardAccess(event, id, 'view')
  const [requests, recommendations, pins] = await Promise.all([listYardRequests(id), listYardRecommendations(id), yardPins(id)])
  return { access, requests, recommendations, pins }
})
