// Save a visit's notes (its advisor, while the request is open).
import { idParam } from '#shared/schemas/common'
import { visitUpdateBody } from '#shared/schemas/advice'
import { updateVisitNotes } from '../../services/advice'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { notes } = await readBodyWith(event, visitUpdateBody)
  const user = await requireUser(event)
  return updateVisitNotes(user, id, notes)
})
