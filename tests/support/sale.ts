// Helpers for seed-sale tests: the demo sale, fresh lots in it, a buyer with a cart, paying on the fake's hosted page.
import { Client, demo, newHomeowner, BASE_URL } from './http'

export const PAYMENTS_URL = process.env.WW_PAYMENTS_URL ?? 'http://127.0.0.1:12111'
export const WEBHOOK_SECRET = process.env.WW_WEBHOOK_SECRET ?? 'whsec_wildward_tests'
export const GOOD_CARD = '4242 4242 4242 4242'
export const DECLINED_CARD = '4000 0000 0000 0002'

let unique = 0
export const tag = () => `${Date.now()}-${process.pid}-${++unique}`

export async function currentSale() {
  const r = await (await demo('homeowner')).get('/api/sale')
  if (r.status !== 200 || !r.body.sale) throw new Error(`no current sale: ${r.status} ${JSON.stringify(r.body)}`)
  return r.body as { sale: { id: number; currency: string; mailFeeMinor: number }; pickups: Array<{ id: number; place: string }> }
}

/** A fresh lot in the demo sale (a collection place of its own, so tests do not share stock). */
export async function newLot(over: Record<string, unknown> = {}) {
  const { sale } = await currentSale()
  const coord = await demo('coordinator')
  const r = await coord.post('/api/admin/sale/lots', { saleId: sale.id, scientificName: 'Asclepias tuberosa', collected: `test lot ${tag()}`, seedsPerPacket: 50, priceMinor: 425, stock: 10, ...over })
  if (r.status !== 201) throw new Error(`lot: ${r.status} ${JSON.stringify(r.body)}`)
  return r.body as { id: number; stock: number; priceMinor: number; saleId: number }
}

/** A sale that closed long ago (never the current one), for closed-sale and other-sale checks. */
export async function pastSale() {
  const coord = await demo('coordinator')
  const r = await coord.post('/api/admin/sale/sales', { name: `Past sale ${tag()}`, opensOn: '2020-03-01', closesOn: '2020-04-01' })
  if (r.status !== 201) throw new Error(`sale: ${r.status} ${JSON.stringify(r.body)}`)
  return r.body as { id: number }
}

export async function buyerWith(lotId: number, quantity = 1) {
  const buyer = await newHomeowner('buyer')
  const r = await buyer.client.put('/api/sale/cart/items', { lotId, quantity })
  if (r.status !== 200) throw new Error(`cart: ${r.status} ${JSON.stringify(r.body)}`)
  return buyer
}

export async function checkoutByCard(client: Client) {
  const { pickups } = await currentSale()
  return client.post('/api/sale/checkout', { delivery: 'pickup', pickupEventId: pickups[0]!.id, payment: 'card' })
}

/** Submits the fake's hosted checkout form, as a browser would. */
export async function payOnHostedPage(url: string, card = GOOD_CARD) {
  return fetch(url, { method: 'POST', body: new URLSearchParams({ card, expiry: '12/34', cvc: '123' }), redirect: 'manual' })
}

export async function paymentsLog() {
  return (await fetch(`${PAYMENTS_URL}/_fake/log`)).json() as Promise<{ sessions: any[]; events: Array<{ id: string; type: string; objectId: string; deliveries: Array<{ status: number }> }>; refunds: any[] }>
}

/** Waits until `check` holds (webhooks arrive a moment after the payment). */
export async function until<T>(get: () => Promise<T>, check: (v: T) => boolean, timeoutMs = 8000): Promise<T> {
  const end = Date.now() + timeoutMs
  for (;;) {
    const v = await get()
    if (check(v) || Date.now() > end) return v
    await new Promise((r) => setTimeout(r, 150))
  }
}

export { BASE_URL }
