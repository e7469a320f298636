// Seed-sale checkout against the built server, MariaDB and the fake payment service: paid, declined, expired,
// replayed and forged webhooks, refund, and 20 buyers racing for the last 3 packets.
import { describe, it, expect } from 'vitest'
import Stripe from 'stripe'
import { demo, waitForMail, Client } from '../../support/http'
import { newLot, buyerWith, checkoutByCard, payOnHostedPage, paymentsLog, until, pastSale, currentSale, PAYMENTS_URL, WEBHOOK_SECRET, DECLINED_CARD } from '../../support/sale'

const order = (c: Client, id: number) => c.get(`/api/sale/orders/${id}`).then((r) => r.body)
const lotStock = async (id: number) => {
  const r = await (await demo('coordinator')).get('/api/admin/sale')
  return (r.body.lots as Array<{ id: number; stock: number }>).find((l) => l.id === id)!.stock
}
const sessionOf = async (orderId: number) => (await paymentsLog()).sessions.find((s) => s.metadata?.orderId === String(orderId))

describe('seed sale checkout', () => {
  it('pays by card on the hosted page; the webhook marks it paid and a receipt with sowing steps is mailed', async () => {
    const lot = await newLot({ priceMinor: 425, stock: 10 })
    const buyer = await buyerWith(lot.id, 2)
    const r = await checkoutByCard(buyer.client)
    expect(r.status).toBe(201)
    expect(r.body.url).toMatch(/^http:\/\/127\.0\.0\.1:\d+\/pay\/cs_test_/)
    expect(await lotStock(lot.id)).toBe(8) // held at checkout: 10 − 2
    let o = await order(buyer.client, r.body.orderId)
    expect(o.status).toBe('awaiting_payment')
    expect(o.totalMinor).toBe(850) // 2 × $4.25, pickup: no fee (by hand)
    const session = await sessionOf(r.body.orderId)
    expect(session.amount_total).toBe(850)

    const pay = await payOnHostedPage(r.body.url)
    expect(pay.status).toBe(303)
    expect(pay.headers.get('location')).toContain(`/sale/orders/${r.body.orderId}?paid=1`)
    o = await until(() => order(buyer.client, r.body.orderId), (v) => v.status === 'paid')
    expect(o.status).toBe('paid')
    const [mail] = await waitForMail(buyer.email)
    expect(mail?.subject).toBe(`Your seed order ${r.body.orderId}: receipt`)
    expect(mail?.text).toContain('2 × Asclepias tuberosa')
    expect(mail?.text).toContain('How to sow each packet')
    expect(mail?.text).toContain('Total: $8.50')

    // a paid order cannot be paid again: the hosted page refuses, and a second signed "completed" event changes nothing
    const again = await payOnHostedPage(r.body.url)
    expect(again.status).toBe(409)
    const completed = (await paymentsLog()).events.find((e) => e.type === 'checkout.session.completed' && e.objectId === session.id)!
    const replay = await fetch(`${PAYMENTS_URL}/_fake/events/${completed.id}/redeliver`, { method: 'POST' }).then((x) => x.json())
    expect(replay.deliveries.at(-1).status).toBe(200)
    const after = await order(buyer.client, r.body.orderId)
    expect(after.paidAt).toBe(o.paidAt)
    expect(await waitForMail(buyer.email, 2, 1500)).toHaveLength(1)
  })

  it('a declined card fails visibly on the hosted page and leaves the order waiting for payment', async () => {
    const lot = await newLot()
    const buyer = await buyerWith(lot.id)
    const r = await checkoutByCard(buyer.client)
    const page = await payOnHostedPage(r.body.url, DECLINED_CARD)
    expect(page.status).toBe(402)
    expect(await page.text()).toContain('Your card was declined.')
    expect((await order(buyer.client, r.body.orderId)).status).toBe('awaiting_payment')
  })

  it('an expired session releases the stock it held and the order returns to the cart', async () => {
    const lot = await newLot({ stock: 5 })
    const buyer = await buyerWith(lot.id, 3)
    const r = await checkoutByCard(buyer.client)
    expect(await lotStock(lot.id)).toBe(2)
    const session = await sessionOf(r.body.orderId)
    expect((await fetch(`${PAYMENTS_URL}/_fake/sessions/${session.id}/expire`, { method: 'POST' })).status).toBe(200)
    const o = await until(() => order(buyer.client, r.body.orderId), (v) => v.status === 'cart')
    expect(o.status).toBe('cart')
    expect(await lotStock(lot.id)).toBe(5)
  })

  it('refuses a webhook with a missing or wrong signature (400) and changes nothing', async () => {
    const lot = await newLot()
    const buyer = await buyerWith(lot.id)
    const r = await checkoutByCard(buyer.client)
    const session = await sessionOf(r.body.orderId)
    const forged = JSON.stringify({ id: 'evt_forged_1', object: 'event', type: 'checkout.session.completed', data: { object: { ...session, status: 'complete', payment_status: 'paid', payment_intent: 'pi_forged' } } })
    const post = (headers: Record<string, string>) => fetch(`${process.env.WW_BASE_URL}/api/payments/webhook`, { method: 'POST', headers: { 'content-type': 'application/json', ...headers }, body: forged })
    expect((await post({})).status).toBe(400)
    const wrongSecret = new Stripe('sk_test_x').webhooks.generateTestHeaderString({ payload: forged, secret: 'whsec_someone_else' })
    expect((await post({ 'stripe-signature': wrongSecret })).status).toBe(400)
    expect((await post({ 'stripe-signature': 't=1,v1=00' })).status).toBe(400)
    expect((await order(buyer.client, r.body.orderId)).status).toBe('awaiting_payment')
    // the same body, signed with the right secret, is accepted: the check, not the body, refused it
    const good = new Stripe('sk_test_x').webhooks.generateTestHeaderString({ payload: forged, secret: WEBHOOK_SECRET })
    expect((await post({ 'stripe-signature': good })).status).toBe(200)
  })

  it('the coordinator cancels a paid order with a refund through the payment service; stock goes back', async () => {
    const lot = await newLot({ stock: 4, priceMinor: 300 })
    const buyer = await buyerWith(lot.id, 3)
    const r = await checkoutByCard(buyer.client)
    await payOnHostedPage(r.body.url)
    await until(() => order(buyer.client, r.body.orderId), (v) => v.status === 'paid')
    const coord = await demo('coordinator')
    const c = await coord.post(`/api/admin/sale/orders/${r.body.orderId}/cancel`)
    expect(c.status).toBe(200)
    expect(c.body.status).toBe('refunded')
    const session = await sessionOf(r.body.orderId)
    const refunds = (await paymentsLog()).refunds.filter((x) => x.payment_intent === session.payment_intent)
    expect(refunds.map((x) => x.amount)).toEqual([900]) // 3 × $3.00 (by hand)
    expect(await lotStock(lot.id)).toBe(4)
    // the charge.refunded webhook arrives after and changes nothing
    const log = await until(paymentsLog, (l) => l.events.some((e) => e.type === 'charge.refunded' && e.deliveries.some((d) => d.status === 200)))
    expect(log.events.some((e) => e.type === 'charge.refunded')).toBe(true)
    expect(await lotStock(lot.id)).toBe(4)
    expect((await order(buyer.client, r.body.orderId)).status).toBe('refunded')
  })

  it('20 buyers check out the last 3 packets at once: exactly 3 succeed, the rest are told it sold out', async () => {
    const lot = await newLot({ stock: 3 })
    const buyers = await Promise.all(Array.from({ length: 20 }, () => buyerWith(lot.id, 1)))
    const { pickups } = await currentSale()
    const results = await Promise.all(buyers.map((b) => b.client.post('/api/sale/checkout', { delivery: 'pickup', pickupEventId: pickups[0]!.id, payment: 'at_pickup' })))
    expect(results.filter((x) => x.status === 201)).toHaveLength(3)
    const refused = results.filter((x) => x.status !== 201)
    expect(refused).toHaveLength(17)
    for (const x of refused) {
      expect(x.status).toBe(409)
      expect(x.body.message).toMatch(/^Sold out/)
    }
    expect(await lotStock(lot.id)).toBe(0)
  })

  it('bad input gets a 400 naming the field', async () => {
    const lot = await newLot({ stock: 2 })
    const buyer = await buyerWith(lot.id, 1)
    const cases: Array<[string, unknown, string]> = [
      ['/api/sale/cart/items', { lotId: lot.id, quantity: -1 }, 'quantity'],
      ['/api/sale/cart/items', { lotId: lot.id, quantity: 3 }, 'quantity'],
    ]
    for (const [path, body, field] of cases) {
      const r = await buyer.client.put(path, body)
      expect(r.status).toBe(400)
      expect(Object.keys(r.body.data.fields)).toContain(field)
    }
    const past = await pastSale()
    const coord = await demo('coordinator')
    const oldLot = await coord.post('/api/admin/sale/lots', { saleId: past.id, scientificName: 'Asclepias tuberosa', collected: 'an old lot', seedsPerPacket: 10, priceMinor: 100, stock: 5 })
    const other = await buyer.client.put('/api/sale/cart/items', { lotId: oldLot.body.id, quantity: 1 })
    expect(other.status).toBe(400)
    expect(other.body.data.fields.lotId).toBe('That lot is not in this sale')
    const pickup = await coord.post('/api/admin/sale/pickups', { saleId: past.id, startsAt: '2020-03-10T10:00', place: 'Old barn' })
    const unknownPickup = await buyer.client.post('/api/sale/checkout', { delivery: 'pickup', pickupEventId: pickup.body.id, payment: 'card' })
    expect(unknownPickup.status).toBe(400)
    expect(unknownPickup.body.data.fields.pickupEventId).toBeTruthy()
    const noPickup = await buyer.client.post('/api/sale/checkout', { delivery: 'pickup', payment: 'card' })
    expect(noPickup.body.data.fields.pickupEventId).toBe('Choose a pickup')
    const negative = await coord.post('/api/admin/sale/lots', { saleId: past.id, scientificName: 'Asclepias tuberosa', collected: 'negative', seedsPerPacket: 10, priceMinor: -5, stock: 5 })
    expect(negative.status).toBe(400)
    expect(negative.body.data.fields.priceMinor).toBeTruthy()
    // amounts come from the lots: a price in the body is ignored
    const sneaky = await buyer.client.put('/api/sale/cart/items', { lotId: lot.id, quantity: 1, unitPriceMinor: 1 })
    expect(sneaky.body.cart.lines[0].unitPriceMinor).toBe(425)
  })
})
