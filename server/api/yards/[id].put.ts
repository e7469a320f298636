// Save a yard's name and/or document; `version` must be the one edited, else 409.
import { idParam } from '#shared/schemas/common'
import { updateYardBody } from '#shared/schemas/yard'
import { updateYard } from '../../services/yards'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  // access before the (document-sized) body
  const { yard, access } = await requireYardAccess(event, id, 'edit')
  const body = await readBodyWith(event, updateYardBody)
  return updateYard(yard, access, body)
})
