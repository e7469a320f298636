import Stripe from 'stripe'

let client: { key: string; stripe: Stripe } | undefined

/**
 * The payment service's official SDK, server side only. With apiHost set it talks to the local fake over plain
 * HTTP; without, to the real service. Only the keys differ between the two.
 */
export function usePayments(): Stripe {
  const c = useRuntimeConfig().payments
  if (!c.secretKey) throw createError({ status: 503, message: 'Card payments are not configured (NUXT_PAYMENTS_SECRET_KEY)' })
  if (client?.key === c.secretKey) return client.stripe
  const local = c.apiHost ? { host: c.apiHost, port: Number(c.apiPort) || undefined, protocol: (c.apiProtocol || 'https') as 'http' | 'https' } : {}
  client = { key: c.secretKey, stripe: new Stripe(c.secretKey, { ...local, maxNetworkRetries: 2, timeout: 20_000 }) }
  return client.stripe
}

/** Verifies a webhook's signature with the SDK and returns the event; 400 (and nothing changed) when it fails. */
export function verifyPaymentEvent(payload: string, signature: string | undefined): Stripe.Event {
  const secret = useRuntimeConfig().payments.webhookSecret
  if (!secret) throw createError({ status: 503, message: 'Payment webhooks are not configured (NUXT_PAYMENTS_WEBHOOK_SECRET)' })
  if (!signature) throw createError({ status: 400, message: 'Missing payment-service signature', data: { fields: { 'stripe-signature': 'Missing' } } })
  try {
    return usePayments().webhooks.constructEvent(payload, signature, secret)
  } catch {
    throw createError({ status: 400, message: 'The payment-service signature does not match', data: { fields: { 'stripe-signature': 'Does not match' } } })
  }
}
