// Create a yard owned by the signed-in user.
import { createYardBody } from '#shared/schemas/yard'
import { createYard } from '../../services/yards'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, createYardBody)
  const user = await requireUser(event)
  setResponseStatus(event, 201)
  return createYard(user, body)
})
