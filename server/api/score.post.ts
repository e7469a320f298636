// The score of a yard as the editor sends it on every change: the whole document, or its changes against the
// basis of an earlier answer (see server/services/score-basis.ts). Nothing is stored in the database.
import { scoreRequest } from '#shared/schemas/score'
import { scoreForRequest } from '../services/score-basis'

export default defineEventHandler(async (event) => {
  const request = await readBodyWith(event, scoreRequest)
  const userId = await requireSignedIn(event)
  return scoreForRequest(userId, request)
})
