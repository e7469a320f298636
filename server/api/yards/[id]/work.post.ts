// Marks plantings or areas of a yard planted or removed on a date, and records the yard's shares then.
import { idParam } from '#shared/schemas/common'
import { markWorkBody } from '#shared/schemas/yard'
import { markWork } from '../../../services/yard-work'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, markWorkBody)
  const { yard } = await requireYardAccess(event, id, 'edit')
  return markWork(yard, body)
})
