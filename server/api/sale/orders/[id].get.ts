// One order: its buyer or a coordinator.
import { idParam } from '#shared/schemas/common'
import { requireOrderAccess, orderView } from '../../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const user = await requireUser(event)
  return orderView(await requireOrderAccess(user, id))
})
