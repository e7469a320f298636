// The payment service's webhook: the signature is checked with the SDK before anything is read or changed.
import { handlePaymentEvent } from '../../services/payment-events'

export default defineEventHandler(async (event) => {
  const payload = (await readRawBody(event, 'utf8')) ?? ''
  const verified = verifyPaymentEvent(payload, getRequestHeader(event, 'stripe-signature'))
  return { received: true, ...(await handlePaymentEvent(verified)) }
})
