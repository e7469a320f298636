// The owner accepts a recommendation: applied to the plan as a versioned save (or recorded after the editor did).
import { idParam } from '#shared/schemas/common'
import { acceptBody } from '#shared/schemas/advice'
import { acceptRecommendation } from '../../../services/recommendations'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, acceptBody)
  const user = await requireUser(event)
  return acceptRecommendation(event, user, id, body)
})
