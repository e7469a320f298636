// The running drive and this yard's pledge to it, for anyone who may view the yard.
import { idParam } from '#shared/schemas/common'
import { yardPledgeState } from '../../../services/drives'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  await requireYardAccess(event, id, 'view')
  return yardPledgeState(id)
})
