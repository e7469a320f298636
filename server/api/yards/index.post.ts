// Create a yard owned by the signed-in user.
import { createYard } from '../../services/yards'
import { readBodyInWorker } from '../../services/score-pool'

export default defineEventHandler(async (event) => {
  // the session before the (document-sized) body
  const user = await requireUser(event)
  const body = await readBodyInWorker(event, 'createYardBody')
  setResponseStatus(event, 201)
  return createYard(user, body)
})
