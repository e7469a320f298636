// Changes a lot: collection, packet contents, price, stock, growing notes.
import { idParam } from '#shared/schemas/common'
import { lotUpdateBody } from '#shared/schemas/sale'
import { updateLot } from '../../../../services/sale'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, lotUpdateBody)
  await requireRole(event, 'coordinator')
  return updateLot(id, body)
})
