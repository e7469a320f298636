// What the editor needs to score the yard in the browser: the goal and the facts of the species it names.
import { idParam } from '#shared/schemas/common'
import { yardScoreInputs } from '../../../services/scoring'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { yard } = await requireYardAccess(event, id, 'view')
  return yardScoreInputs(yard.document, yard.region)
})
