// One yard with its document, for anyone who may view it.
import { idParam } from '#shared/schemas/common'
import { yardView } from '../../services/yards'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { yard, access } = await requireYardAccess(event, id, 'view')
  return yardView(yard, access)
})
