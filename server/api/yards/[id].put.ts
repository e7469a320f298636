// Save a yard's name and/or document; `version` must be the one edited, else 409.
import { idParam } from '#shared/schemas/common'
import { updateYard } from '../../services/yards'
import { readBodyInWorker } from '../../services/score-pool'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  // access before the (document-sized) body
  const { yard, access } = await requireYardAccess(event, id, 'edit')
  const body = await readBodyInWorker(event, 'updateYardBody')
  return updateYard(yard, access, body)
})
