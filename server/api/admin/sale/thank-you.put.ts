// Changes the thank-you e-mail ({name}, {amount} and {dedication} are filled in).
import { thankYouBody } from '#shared/schemas/sale'
import { saveThankYouTemplate } from '../../../services/sale-mail'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, thankYouBody)
  await requireRole(event, 'coordinator')
  return saveThankYouTemplate(body)
})
