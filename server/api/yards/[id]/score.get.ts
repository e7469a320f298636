// The score of a saved yard, for anyone who may view it.
import { idParam } from '#shared/schemas/common'
import { scoreDocument } from '../../../services/scoring'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { yard } = await requireYardAccess(event, id, 'view')
  return scoreDocument(yard.document, yard.region)
})
