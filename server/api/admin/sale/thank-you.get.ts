// The thank-you e-mail sent with each donation receipt.
import { thankYouTemplate } from '../../../services/sale-mail'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'coordinator')
  return thankYouTemplate()
})
