// Who a yard is shared with (invites and members), for its owner.
import { idParam } from '#shared/schemas/common'
import { listShares } from '../../../services/sharing'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  await requireYardAccess(event, id, 'owner')
  return listShares(id)
})
