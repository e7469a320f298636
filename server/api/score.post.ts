// The score of a yard as the editor sends it on every change: the whole document, or its changes against the
// basis of an earlier answer (see server/services/score-basis.ts). Nothing is stored in the database.
import { scoreRequest } from '#shared/schemas/score'
import { scoreForRequest } from '../services/score-basis'

export default defineEventHandler(async (event) => {
  // the session before the body: nobody signed out gets a document-sized body read
  const userId = await requireSignedIn(event)
  const request = await readBodyWith(event, scoreRequest)
  return scoreForRequest(userId, request)
})
