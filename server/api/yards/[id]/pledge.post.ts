// Pledge a yard to the running drive (its owner): neighbourhood or postal code, and consent to count in totals.
import { idParam } from '#shared/schemas/common'
import { pledgeBody } from '#shared/schemas/drives'
import { pledgeYard } from '../../../services/drives'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, pledgeBody)
  const { user, yard } = await requireYardAccess(event, id, 'owner')
  const result = await pledgeYard(user, yard, body)
  setResponseStatus(event, result.created ? 201 : 200)
  return result
})
