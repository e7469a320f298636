// Record a site visit for a request (the assigned advisor, while it is open).
import { idParam } from '#shared/schemas/common'
import { visitBody } from '#shared/schemas/advice'
import { createVisit } from '../../../services/advice'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, visitBody)
  const user = await requireUser(event)
  setResponseStatus(event, 201)
  return createVisit(user, id, body)
})
