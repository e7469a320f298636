// What the payment service's webhook events do. Each event id is stored in the same transaction as its effect,
// so a redelivered event changes nothing; a paid order or donation is never paid twice.
import { and, eq } from 'drizzle-orm'
import type Stripe from 'stripe'
import { paymentEvents, donations } from '../database/schema'
import { checkoutPaid, checkoutExpired, paymentRefunded } from './sale-orders'
import { sendOrderReceipt, sendDonationReceipt } from './sale-mail'

export async function handlePaymentEvent(event: Stripe.Event): Promise<{ duplicate: boolean }> {
  const receipts: Array<() => Promise<void>> = []
  const duplicate = await useDb().transaction(async (tx) => {
    const [r] = await tx.insert(paymentEvents).ignore().values({ eventId: event.id, type: event.type })
    if (r.affectedRows === 0) return true
    switch (event.type) {
      case 'checkout.session.completed':
      case 'checkout.session.async_payment_succeeded': {
        const s = event.data.object
        if (s.payment_status !== 'paid') break
        const pi = typeof s.payment_intent === 'string' ? s.payment_intent : s.payment_intent?.id ?? null
        if (s.metadata?.kind === 'donation') {
          const [d] = await tx.update(donations).set({ status: 'paid', paidAt: new Date(), paymentIntentId: pi })
            .where(and(eq(donations.checkoutSessionId, s.id), eq(donations.status, 'awaiting_payment')))
          const [row] = await tx.select({ id: donations.id }).from(donations).where(eq(donations.checkoutSessionId, s.id))
          if (d.affectedRows && row) receipts.push(() => sendDonationReceipt(row.id))
        } else {
          const orderId = await checkoutPaid(tx, s.id, pi)
          if (orderId) receipts.push(() => sendOrderReceipt(orderId))
        }
        break
      }
      case 'checkout.session.expired': {
        const s = event.data.object
        if (s.metadata?.kind === 'donation') await tx.update(donations).set({ status: 'cancelled' }).where(and(eq(donations.checkoutSessionId, s.id), eq(donations.status, 'awaiting_payment')))
        else await checkoutExpired(s.id, tx)
        break
      }
      case 'charge.refunded': {
        const c = event.data.object
        const pi = typeof c.payment_intent === 'string' ? c.payment_intent : c.payment_intent?.id
        if (!pi || !c.refunded) break
        await paymentRefunded(tx, pi)
        await tx.update(donations).set({ status: 'refunded' }).where(and(eq(donations.paymentIntentId, pi), eq(donations.status, 'paid')))
        break
      }
    }
    return false
  })
  for (const send of receipts) await send().catch((e) => console.error('[payments] receipt mail failed:', (e as Error).message))
  return { duplicate }
}
