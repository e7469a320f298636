// The effect a change would have on the three shares, before it is recorded or applied.
import { idParam } from '#shared/schemas/common'
import { recommendationBody } from '#shared/schemas/advice'
import { previewRecommendation } from '../../../../services/recommendations'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { change } = await readBodyWith(event, recommendationBody)
  const user = await requireUser(event)
  return previewRecommendation(user, id, change)
})
