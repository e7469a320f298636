// Changes a sale: dates, pause, mail delivery and its flat fee.
import { idParam } from '#shared/schemas/common'
import { saleBody } from '#shared/schemas/sale'
import { updateSale } from '../../../../services/sale'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, saleBody)
  await requireRole(event, 'coordinator')
  return updateSale(id, body)
})
