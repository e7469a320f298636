// The printable pick list of one pickup: packets by species, then by order.
import { idParam } from '#shared/schemas/common'
import { pickList } from '../../../../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  await requireRole(event, 'coordinator')
  return pickList(id)
})
