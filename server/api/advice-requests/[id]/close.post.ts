// Close a request (coordinator, requester or assigned advisor); the advisor's editing access ends.
import { idParam } from '#shared/schemas/common'
import { closeRequestBody } from '#shared/schemas/advice'
import { closeRequest } from '../../../services/advice'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { note } = await readBodyWith(event, closeRequestBody)
  const user = await requireUser(event)
  return closeRequest(user, id, note)
})
