// Save a yard's name and/or document; `version` must be the one edited, else 409.
import { idParam } from '#shared/schemas/common'
import { updateYardBody } from '#shared/schemas/yard'
import { updateYard } from '../../services/yards'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, updateYardBody)
  const { yard, access } = await requireYardAccess(event, id, 'edit')
  return updateYard(yard, access, body)
})
