// Create a yard owned by the signed-in user.
import { createYardBody } from '#shared/schemas/yard'
import { createYard } from '../../services/yards'

export default defineEventHandler(async (event) => {
  // the session before the (document-sized) body
  const user = await requireUser(event)
  const body = await readBodyWith(event, createYardBody)
  setResponseStatus(event, 201)
  return createYard(user, body)
})
