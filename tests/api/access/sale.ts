import type { AccessRow, AccessContext } from './types'
import { demo } from '../../support/http'

const SIGNED_IN = { anonymous: 401, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 }
const BUYERS = { anonymous: 401, owner: 200, otherHomeowner: 200, advisor: 403, coordinator: 200 }
const COORDINATOR = { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 403, coordinator: 200 }
const CREATED = { ...COORDINATOR, coordinator: 201 }
const BUYER_ONLY = { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 200 }

const coordinator = () => demo('coordinator')
/** A sale that closed long ago, so rows that change sales never touch the current one. */
async function pastSale() {
  const r = await (await coordinator()).post('/api/admin/sale/sales', { name: `Matrix sale ${Date.now()}-${Math.random()}`, opensOn: '2020-01-01', closesOn: '2020-02-01' })
  return r.body.id as number
}
async function pastPickup() {
  const r = await (await coordinator()).post('/api/admin/sale/pickups', { saleId: await pastSale(), startsAt: '2020-01-15T10:00', place: 'Matrix shed' })
  return r.body.id as number
}
async function pastLot() {
  const r = await (await coordinator()).post('/api/admin/sale/lots', { saleId: await pastSale(), scientificName: 'Asclepias tuberosa', collected: 'matrix lot', seedsPerPacket: 10, priceMinor: 100, stock: 5 })
  return r.body.id as number
}
/** An order of the owner's in the current sale, placed to pay at pickup. */
async function ownerOrder(c: AccessContext) {
  const shop = (await c.owner.get('/api/sale')).body
  const lot = shop.lots.find((l: { stock: number }) => l.stock > 0)
  await c.owner.put('/api/sale/cart/items', { lotId: lot.id, quantity: 1 })
  const r = await c.owner.post('/api/sale/checkout', { delivery: 'pickup', pickupEventId: shop.pickups[0].id, payment: 'at_pickup' })
  return r.body.orderId as number
}
async function ownerCardOrder(c: AccessContext) {
  const shop = (await c.owner.get('/api/sale')).body
  const lot = shop.lots.find((l: { stock: number }) => l.stock > 0)
  await c.owner.put('/api/sale/cart/items', { lotId: lot.id, quantity: 1 })
  const r = await c.owner.post('/api/sale/checkout', { delivery: 'pickup', pickupEventId: shop.pickups[0].id, payment: 'card' })
  return r.body.orderId as number
}

export const rows: AccessRow[] = [
  { file: 'sale/index.get.ts', method: 'GET', request: () => ({ path: '/api/sale?region=US-OH&sun=full' }), expect: SIGNED_IN },
  { file: 'sale/cart.get.ts', method: 'GET', request: () => ({ path: '/api/sale/cart' }), expect: BUYERS },
  { file: 'sale/cart/items.put.ts', method: 'PUT', request: async () => ({ path: '/api/sale/cart/items', body: { lotId: (await (await demo('homeowner')).get('/api/sale')).body.lots[0].id, quantity: 0 } }), expect: BUYERS },
  {
    file: 'sale/cart/from-plan.post.ts', method: 'POST',
    request: (c) => ({ path: '/api/sale/cart/from-plan', body: { yardId: c.yardId } }),
    // a yard someone may not see is not revealed (404); advisors do not buy
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 403, coordinator: 404 },
  },
  {
    file: 'sale/checkout.post.ts', method: 'POST',
    // the personas' carts are empty: a 400 naming the items, after access is checked
    request: () => ({ path: '/api/sale/checkout', body: { delivery: 'mail', mailingAddress: '12 Quarry Row, Alderwick Crossing', payment: 'card' } }),
    expect: { anonymous: 401, owner: 400, otherHomeowner: 400, advisor: 403, coordinator: 400 },
  },
  { file: 'sale/orders/index.get.ts', method: 'GET', request: () => ({ path: '/api/sale/orders' }), expect: BUYERS },
  { file: 'sale/orders/[id].get.ts', method: 'GET', request: async (c) => ({ path: `/api/sale/orders/${await ownerOrder(c)}` }), expect: BUYER_ONLY },
  {
    file: 'sale/orders/[id]/abandon.post.ts', method: 'POST',
    request: async (c) => ({ path: `/api/sale/orders/${await ownerCardOrder(c)}/abandon` }),
    expect: { ...BUYER_ONLY, coordinator: 403 },
  },
  { file: 'donations/index.post.ts', method: 'POST', request: () => ({ path: '/api/donations', body: { amountMinor: 500 } }), expect: { anonymous: 401, owner: 201, otherHomeowner: 201, advisor: 201, coordinator: 201 } },
  { file: 'donations/index.get.ts', method: 'GET', request: () => ({ path: '/api/donations' }), expect: SIGNED_IN },
  // the payment service signs its webhooks; nobody's session matters, and an unsigned call is refused
  { file: 'payments/webhook.post.ts', method: 'POST', request: () => ({ path: '/api/payments/webhook', body: { id: 'evt_x', type: 'checkout.session.completed' } }), expect: { anonymous: 400, owner: 400, otherHomeowner: 400, advisor: 400, coordinator: 400 } },
  { file: 'admin/sale/index.get.ts', method: 'GET', request: () => ({ path: '/api/admin/sale' }), expect: COORDINATOR },
  { file: 'admin/sale/sales.post.ts', method: 'POST', request: () => ({ path: '/api/admin/sale/sales', body: { name: 'Matrix sale', opensOn: '2019-01-01', closesOn: '2019-01-31' } }), expect: CREATED },
  { file: 'admin/sale/sales/[id].put.ts', method: 'PUT', request: async () => ({ path: `/api/admin/sale/sales/${await pastSale()}`, body: { name: 'Matrix sale renamed', opensOn: '2020-01-01', closesOn: '2020-02-01', paused: true } }), expect: COORDINATOR },
  { file: 'admin/sale/pickups.post.ts', method: 'POST', request: async () => ({ path: '/api/admin/sale/pickups', body: { saleId: await pastSale(), startsAt: '2020-01-20T09:30', place: 'Matrix porch' } }), expect: CREATED },
  { file: 'admin/sale/pickups/[id].delete.ts', method: 'DELETE', request: async () => ({ path: `/api/admin/sale/pickups/${await pastPickup()}` }), expect: COORDINATOR },
  { file: 'admin/sale/pickups/[id]/pick-list.get.ts', method: 'GET', request: async () => ({ path: `/api/admin/sale/pickups/${await pastPickup()}/pick-list` }), expect: COORDINATOR },
  { file: 'admin/sale/lots.post.ts', method: 'POST', request: async () => ({ path: '/api/admin/sale/lots', body: { saleId: await pastSale(), scientificName: 'Asclepias tuberosa', collected: 'matrix collection', seedsPerPacket: 20, priceMinor: 250, stock: 3 } }), expect: CREATED },
  { file: 'admin/sale/lots/[id].put.ts', method: 'PUT', request: async () => ({ path: `/api/admin/sale/lots/${await pastLot()}`, body: { stock: 7 } }), expect: COORDINATOR },
  { file: 'admin/sale/lots/export.get.ts', method: 'GET', request: async () => ({ path: `/api/admin/sale/lots/export?saleId=${await pastSale()}` }), expect: COORDINATOR },
  {
    file: 'admin/sale/lots/import.post.ts', method: 'POST',
    request: async () => ({ path: `/api/admin/sale/lots/import?saleId=${await pastSale()}`, body: 'species,collected,seeds_per_packet,price,stock\nAsclepias tuberosa,matrix import,30,2.50,4\n' }),
    expect: COORDINATOR,
  },
  { file: 'admin/sale/orders.get.ts', method: 'GET', request: () => ({ path: '/api/admin/sale/orders?paid=no' }), expect: COORDINATOR },
  { file: 'admin/sale/orders/export.get.ts', method: 'GET', request: () => ({ path: '/api/admin/sale/orders/export' }), expect: COORDINATOR },
  {
    file: 'admin/sale/orders/[id]/status.put.ts', method: 'PUT',
    request: async (c) => ({ path: `/api/admin/sale/orders/${await ownerOrder(c)}/status`, body: { status: 'packed' } }),
    expect: COORDINATOR,
  },
  { file: 'admin/sale/orders/[id]/cancel.post.ts', method: 'POST', request: async (c) => ({ path: `/api/admin/sale/orders/${await ownerOrder(c)}/cancel` }), expect: COORDINATOR },
  { file: 'admin/sale/donations.get.ts', method: 'GET', request: () => ({ path: '/api/admin/sale/donations' }), expect: COORDINATOR },
  { file: 'admin/sale/donations/export.get.ts', method: 'GET', request: () => ({ path: '/api/admin/sale/donations/export' }), expect: COORDINATOR },
  { file: 'admin/sale/thank-you.get.ts', method: 'GET', request: () => ({ path: '/api/admin/sale/thank-you' }), expect: COORDINATOR },
  { file: 'admin/sale/thank-you.put.ts', method: 'PUT', request: () => ({ path: '/api/admin/sale/thank-you', body: { subject: 'Thank you, {name}', body: 'Dear {name}, thank you for {amount}{dedication}.' } }), expect: COORDINATOR },
]
