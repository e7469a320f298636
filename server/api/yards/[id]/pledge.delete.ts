// Withdraw a yard's pledge to the running drive (its owner).
import { idParam } from '#shared/schemas/common'
import { withdrawPledge } from '../../../services/drives'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  await requireYardAccess(event, id, 'owner')
  await withdrawPledge(id)
  setResponseStatus(event, 204)
  return null
})
