// A yard's native shares over time, recorded each time work was marked done.
import { idParam } from '#shared/schemas/common'
import { yardHistory } from '../../../services/yard-work'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  await requireYardAccess(event, id, 'view')
  return yardHistory(id)
})
