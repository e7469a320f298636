// Seed-sale orders: the cart, checkout (stock held in the database, never oversold), payment outcomes, the
// coordinator's packing, pickup, cancelling with a refund, pick lists and lists.
import { and, asc, desc, eq, inArray, isNotNull, isNull, sql, type SQL } from 'drizzle-orm'
import { saleOrders, saleOrderItems, seedLots, users, pickupEvents, seedSales } from '../database/schema'
import type { AccountRow, YardRow } from '../database/schema'
import { requireOpenSale, lotViews, currentSale, saleById, type LotView } from './sale'
import { sendOrderReceipt } from './sale-mail'
import { seedPlanFor } from './seed-plan'
import { orderTotals } from '#shared/utils/money'
import { packetsForPlan } from '#shared/utils/seed-sale'
import type { CheckoutBody } from '#shared/schemas/sale'
import type { OrderStatus } from '#shared/utils/labels'

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]
export type OrderRow = typeof saleOrders.$inferSelect

/** Checkout sessions live this long (the payment service's shortest allowed), then expire and release stock. */
export const CHECKOUT_MINUTES = 30
/** Orders that count as sold (their packets are spoken for, and once paid, their money is in). */
export const LIVE_STATUSES: OrderStatus[] = ['awaiting_payment', 'paid', 'packed', 'picked_up', 'sent']

// ---------------------------------------------------------------------------------------------------------------
// Reading orders

export interface OrderLine { lotId: number; quantity: number; unitPriceMinor: number; lot: LotView }

export async function orderLines(order: OrderRow): Promise<OrderLine[]> {
  const rows = await useDb().select({ item: saleOrderItems, lot: seedLots }).from(saleOrderItems)
    .innerJoin(seedLots, eq(seedLots.id, saleOrderItems.lotId)).where(eq(saleOrderItems.orderId, order.id)).orderBy(asc(seedLots.scientificName))
  const views = await lotViews(rows.map((r) => r.lot), order.currency)
  return rows.map((r, i) => ({ lotId: r.lot.id, quantity: r.item.quantity, unitPriceMinor: order.status === 'cart' ? r.lot.priceMinor : r.item.unitPriceMinor, lot: views[i]! }))
}

export async function orderView(order: OrderRow) {
  const lines = await orderLines(order)
  const [pickup] = order.pickupEventId ? await useDb().select().from(pickupEvents).where(eq(pickupEvents.id, order.pickupEventId)).limit(1) : []
  const [buyer] = await useDb().select({ name: users.name, email: users.email }).from(users).where(eq(users.id, order.userId)).limit(1)
  const sale = await saleById(order.saleId)
  // a cart shows what it would cost now; a placed order what was charged
  const totals = order.status === 'cart' ? orderTotals(lines, 0) : { subtotalMinor: order.subtotalMinor, deliveryFeeMinor: order.deliveryFeeMinor, totalMinor: order.totalMinor }
  const { checkoutSessionId: _c, paymentIntentId: _p, ...rest } = order
  return { ...rest, ...totals, lines, pickup: pickup ?? null, buyer: buyer ?? null, sale: { id: sale.id, name: sale.name, mailEnabled: sale.mailEnabled, mailFeeMinor: sale.mailFeeMinor } }
}

/** An order its buyer or a coordinator may see; 404 for anyone else (its existence is not revealed). */
export async function requireOrderAccess(user: AccountRow, id: number): Promise<OrderRow> {
  const [order] = await useDb().select().from(saleOrders).where(eq(saleOrders.id, id)).limit(1)
  if (!order || (order.userId !== user.id && user.role !== 'coordinator')) throw createError({ status: 404, message: 'No such order' })
  return order
}

export async function myOrders(user: AccountRow) {
  const rows = await useDb().select().from(saleOrders).where(and(eq(saleOrders.userId, user.id), sql`${saleOrders.status} <> 'cart'`)).orderBy(desc(saleOrders.id))
  return Promise.all(rows.map(orderView))
}

// ---------------------------------------------------------------------------------------------------------------
// The cart (one per user: the row is created under a lock on the user's row)

async function cartFor(tx: Tx, userId: number, saleId: number, currency: string): Promise<OrderRow> {
  await tx.select({ id: users.id }).from(users).where(eq(users.id, userId)).for('update')
  const [cart] = await tx.select().from(saleOrders).where(and(eq(saleOrders.userId, userId), eq(saleOrders.status, 'cart'))).limit(1)
  if (cart && cart.saleId === saleId) return cart
  if (cart) {
    // a cart left from an earlier sale starts over in this one
    await tx.delete(saleOrderItems).where(eq(saleOrderItems.orderId, cart.id))
    await tx.update(saleOrders).set({ saleId, currency }).where(eq(saleOrders.id, cart.id))
    return { ...cart, saleId, currency }
  }
  const id = insertedId(await tx.insert(saleOrders).values({ userId, saleId, currency, status: 'cart' }).$returningId())
  const [row] = await tx.select().from(saleOrders).where(eq(saleOrders.id, id))
  return row!
}

export async function getCart(user: AccountRow) {
  const sale = await currentSale()
  const [cart] = await useDb().select().from(saleOrders).where(and(eq(saleOrders.userId, user.id), eq(saleOrders.status, 'cart'))).limit(1)
  if (!cart || !sale || cart.saleId !== sale.id) return null
  return orderView(cart)
}

/** Sets how many packets of a lot are in the cart (0 takes it out); never more than the lot has now. */
export async function setCartItem(user: AccountRow, lotId: number, quantity: number) {
  const sale = await requireOpenSale()
  await useDb().transaction(async (tx) => {
    const [lot] = await tx.select().from(seedLots).where(eq(seedLots.id, lotId)).limit(1)
    if (!lot || lot.saleId !== sale.id) throw invalidInput({ lotId: 'That lot is not in this sale' })
    if (quantity > lot.stock) throw invalidInput({ quantity: lot.stock === 0 ? 'Sold out' : `Only ${lot.stock} left` })
    const cart = await cartFor(tx, user.id, sale.id, sale.currency)
    if (quantity === 0) await tx.delete(saleOrderItems).where(and(eq(saleOrderItems.orderId, cart.id), eq(saleOrderItems.lotId, lotId)))
    else await tx.insert(saleOrderItems).values({ orderId: cart.id, lotId, quantity, unitPriceMinor: lot.priceMinor }).onDuplicateKeyUpdate({ set: { quantity, unitPriceMinor: lot.priceMinor } })
  })
  return getCart(user)
}

/** Puts in the cart the packets that cover a yard's seed plan; says which species have no lot. */
export async function cartFromPlan(user: AccountRow, yard: YardRow) {
  const sale = await requireOpenSale()
  const plan = await seedPlanFor(yard)
  const needs = plan.species.filter((s) => s.grow && s.seeds > 0).map((s) => ({ key: s.key, scientificName: s.scientificName, seeds: s.seeds, grams: s.grams }))
  const lots = await useDb().select().from(seedLots).where(eq(seedLots.saleId, sale.id))
  const { picks, missing } = packetsForPlan(needs, lots)
  const short: Array<{ scientificName: string; wanted: number; inCart: number }> = []
  await useDb().transaction(async (tx) => {
    const cart = await cartFor(tx, user.id, sale.id, sale.currency)
    for (const p of picks) {
      const lot = lots.find((l) => l.id === p.lotId)!
      const quantity = Math.min(p.packets, lot.stock)
      if (quantity < p.packets) short.push({ scientificName: p.scientificName, wanted: p.packets, inCart: quantity })
      if (quantity > 0) await tx.insert(saleOrderItems).values({ orderId: cart.id, lotId: lot.id, quantity, unitPriceMinor: lot.priceMinor }).onDuplicateKeyUpdate({ set: { quantity, unitPriceMinor: lot.priceMinor } })
    }
  })
  return { added: picks, missing, short, cart: await getCart(user) }
}

// ---------------------------------------------------------------------------------------------------------------
// Checkout

function soldOut(name: string, left: number, index: number) {
  return invalidInput({ [`items.${index}.quantity`]: left === 0 ? 'Sold out' : `Only ${left} left` }, left === 0 ? `Sold out: ${name} has no packets left` : `Sold out: only ${left} packet${left === 1 ? '' : 's'} of ${name} left`, 409)
}

/** Takes the order's packets out of stock, each lot by a conditional update, in one transaction. */
async function holdStock(tx: Tx, order: OrderRow) {
  const items = await tx.select({ item: saleOrderItems, lot: seedLots }).from(saleOrderItems).innerJoin(seedLots, eq(seedLots.id, saleOrderItems.lotId))
    .where(eq(saleOrderItems.orderId, order.id)).orderBy(asc(seedLots.id))
  if (!items.length) throw invalidInput({ items: 'Your cart is empty' })
  const lines: Array<{ quantity: number; unitPriceMinor: number; name: string; lotId: number }> = []
  for (const [i, { item, lot }] of items.entries()) {
    if (lot.saleId !== order.saleId) throw invalidInput({ [`items.${i}.lotId`]: 'That lot is not in this sale' })
    const [r] = await tx.update(seedLots).set({ stock: sql`${seedLots.stock} - ${item.quantity}` })
      .where(and(eq(seedLots.id, lot.id), sql`${seedLots.stock} >= ${item.quantity}`))
    if (r.affectedRows === 0) {
      const [now] = await tx.select({ stock: seedLots.stock }).from(seedLots).where(eq(seedLots.id, lot.id))
      throw soldOut(lot.scientificName, now?.stock ?? 0, i)
    }
    // the price is fixed when checkout starts, from the lot, never from the client
    await tx.update(saleOrderItems).set({ unitPriceMinor: lot.priceMinor }).where(eq(saleOrderItems.id, item.id))
    lines.push({ quantity: item.quantity, unitPriceMinor: lot.priceMinor, name: `${lot.scientificName} seed (${lot.collected})`, lotId: lot.id })
  }
  return lines
}

/** Puts an order's held packets back into stock, once (the stockHeld flag is cleared by the same conditional update). */
async function releaseStock(tx: Tx, orderId: number) {
  const [r] = await tx.update(saleOrders).set({ stockHeld: false }).where(and(eq(saleOrders.id, orderId), eq(saleOrders.stockHeld, true)))
  if (r.affectedRows === 0) return
  const items = await tx.select().from(saleOrderItems).where(eq(saleOrderItems.orderId, orderId)).orderBy(asc(saleOrderItems.lotId))
  for (const it of items) await tx.update(seedLots).set({ stock: sql`${seedLots.stock} + ${it.quantity}` }).where(eq(seedLots.id, it.lotId))
}

export async function startCheckout(user: AccountRow, body: CheckoutBody) {
  const sale = await requireOpenSale()
  const db = useDb()
  if (body.delivery === 'pickup') {
    const [pickup] = await db.select().from(pickupEvents).where(eq(pickupEvents.id, body.pickupEventId!)).limit(1)
    if (!pickup || pickup.saleId !== sale.id) throw invalidInput({ pickupEventId: 'Not a pickup of this sale' })
  } else if (!sale.mailEnabled) throw invalidInput({ delivery: 'This sale does not send seed by mail' })

  const placed = await db.transaction(async (tx) => {
    await tx.select({ id: users.id }).from(users).where(eq(users.id, user.id)).for('update')
    const [cart] = await tx.select().from(saleOrders).where(and(eq(saleOrders.userId, user.id), eq(saleOrders.status, 'cart'))).limit(1)
    if (!cart) throw invalidInput({ items: 'Your cart is empty' })
    if (cart.saleId !== sale.id) throw invalidInput({ sale: 'Your cart is from a sale that has closed' })
    const lines = await holdStock(tx, cart)
    const totals = orderTotals(lines, body.delivery === 'mail' ? sale.mailFeeMinor : 0)
    await tx.update(saleOrders).set({
      status: 'awaiting_payment', delivery: body.delivery, pickupEventId: body.delivery === 'pickup' ? body.pickupEventId : null,
      mailingAddress: body.delivery === 'mail' ? body.mailingAddress : null, payment: body.payment, currency: sale.currency,
      ...totals, stockHeld: true, placedAt: new Date(),
    }).where(eq(saleOrders.id, cart.id))
    return { orderId: cart.id, lines, totals }
  })

  if (body.payment === 'at_pickup') {
    await sendOrderReceipt(placed.orderId).catch((e) => console.error('[sale] receipt mail failed:', (e as Error).message))
    return { orderId: placed.orderId, url: null }
  }
  try {
    const session = await usePayments().checkout.sessions.create({
      mode: 'payment',
      line_items: [
        ...placed.lines.map((l) => ({ quantity: l.quantity, price_data: { currency: sale.currency, unit_amount: l.unitPriceMinor, product_data: { name: l.name } } })),
        ...(placed.totals.deliveryFeeMinor ? [{ quantity: 1, price_data: { currency: sale.currency, unit_amount: placed.totals.deliveryFeeMinor, product_data: { name: 'Mail delivery' } } }] : []),
      ],
      client_reference_id: `order-${placed.orderId}`,
      customer_email: user.email,
      metadata: { kind: 'order', orderId: String(placed.orderId) },
      success_url: appLink(`/sale/orders/${placed.orderId}?paid=1`),
      cancel_url: appLink(`/sale/orders/${placed.orderId}?cancelled=1`),
      expires_at: Math.floor(Date.now() / 1000) + CHECKOUT_MINUTES * 60,
    }, { idempotencyKey: `order-${placed.orderId}-${Date.now()}` })
    await db.update(saleOrders).set({ checkoutSessionId: session.id }).where(eq(saleOrders.id, placed.orderId))
    return { orderId: placed.orderId, url: session.url }
  } catch (e) {
    // the payment service could not start: the packets go back and the order back to the cart
    await db.transaction(async (tx) => {
      await releaseStock(tx, placed.orderId)
      await tx.update(saleOrders).set({ status: 'cart', placedAt: null }).where(eq(saleOrders.id, placed.orderId))
    })
    throw createError({ status: 502, message: `The payment service did not answer; nothing was charged. ${(e as Error).message}` })
  }
}

/** The buyer left the hosted checkout: the session is expired and the order returns to the cart. */
export async function abandonCheckout(order: OrderRow) {
  if (order.status !== 'awaiting_payment' || order.payment !== 'card' || !order.checkoutSessionId) return
  try {
    await usePayments().checkout.sessions.expire(order.checkoutSessionId)
  } catch (e) {
    const s = await usePayments().checkout.sessions.retrieve(order.checkoutSessionId)
    if (s.status === 'complete') return
    if (s.status !== 'expired') throw e
  }
  await checkoutExpired(order.checkoutSessionId)
}

// ---------------------------------------------------------------------------------------------------------------
// Payment outcomes (called from the webhook inside its transaction, or directly)

/** The session was paid: the order is paid, once. Returns the order id when this call made it paid. */
export async function checkoutPaid(tx: Tx, sessionId: string, paymentIntentId: string | null): Promise<number | null> {
  const [order] = await tx.select().from(saleOrders).where(eq(saleOrders.checkoutSessionId, sessionId)).for('update')
  if (!order) return null
  const [r] = await tx.update(saleOrders).set({ status: 'paid', paidAt: new Date(), paymentIntentId })
    .where(and(eq(saleOrders.id, order.id), eq(saleOrders.status, 'awaiting_payment'), isNull(saleOrders.paidAt)))
  return r.affectedRows ? order.id : null
}

/** The session expired unpaid: its stock is released; the order goes back to the cart unless a new cart exists. */
export async function checkoutExpired(sessionId: string, outer?: Tx) {
  const work = async (tx: Tx) => {
    const [order] = await tx.select().from(saleOrders).where(eq(saleOrders.checkoutSessionId, sessionId)).for('update')
    if (!order || order.status !== 'awaiting_payment' || order.paidAt) return
    await tx.select({ id: users.id }).from(users).where(eq(users.id, order.userId)).for('update')
    const [other] = await tx.select({ id: saleOrders.id }).from(saleOrders).where(and(eq(saleOrders.userId, order.userId), eq(saleOrders.status, 'cart'))).limit(1)
    await releaseStock(tx, order.id)
    await tx.update(saleOrders).set(other ? { status: 'cancelled', closedAt: new Date() } : { status: 'cart', placedAt: null }).where(eq(saleOrders.id, order.id))
  }
  return outer ? work(outer) : useDb().transaction(work)
}

/** The payment was refunded at the payment service: the order is refunded and its held stock released. */
export async function paymentRefunded(tx: Tx, paymentIntentId: string) {
  const [order] = await tx.select().from(saleOrders).where(eq(saleOrders.paymentIntentId, paymentIntentId)).for('update')
  if (!order || order.status === 'refunded') return
  await releaseStock(tx, order.id)
  await tx.update(saleOrders).set({ status: 'refunded', closedAt: new Date() }).where(eq(saleOrders.id, order.id))
}

// ---------------------------------------------------------------------------------------------------------------
// Coordinator

const NEXT: Record<'packed' | 'picked_up' | 'sent', { from: OrderStatus[]; delivery?: 'pickup' | 'mail' }> = {
  packed: { from: ['paid', 'awaiting_payment'] },
  picked_up: { from: ['paid', 'packed', 'awaiting_payment'], delivery: 'pickup' },
  sent: { from: ['paid', 'packed'], delivery: 'mail' },
}

export async function setOrderStatus(orderId: number, status: 'packed' | 'picked_up' | 'sent') {
  const rule = NEXT[status]
  const db = useDb()
  const [order] = await db.select().from(saleOrders).where(eq(saleOrders.id, orderId)).limit(1)
  if (!order) throw createError({ status: 404, message: 'No such order' })
  const unpaidCard = order.status === 'awaiting_payment' && order.payment !== 'at_pickup'
  if (!rule.from.includes(order.status) || unpaidCard || (rule.delivery && order.delivery !== rule.delivery)) {
    throw invalidInput({ status: `A ${order.status.replace('_', ' ')} ${order.delivery ?? ''} order cannot be marked ${status.replace('_', ' ')}` }, undefined, 409)
  }
  // paying at pickup: picking up is when the money comes in
  const paidNow = status === 'picked_up' && !order.paidAt
  const [r] = await db.update(saleOrders).set({ status, ...(paidNow ? { paidAt: new Date() } : {}), ...(status !== 'packed' ? { stockHeld: false, closedAt: new Date() } : {}) })
    .where(and(eq(saleOrders.id, orderId), eq(saleOrders.status, order.status)))
  if (!r.affectedRows) throw createError({ status: 409, message: 'Someone changed this order just now; reload it' })
  return orderView({ ...order, status })
}

/** Cancels an order; a card payment is refunded through the payment service first. Its stock goes back. */
export async function cancelOrder(orderId: number) {
  const db = useDb()
  const [order] = await db.select().from(saleOrders).where(eq(saleOrders.id, orderId)).limit(1)
  if (!order) throw createError({ status: 404, message: 'No such order' })
  if (!['awaiting_payment', 'paid', 'packed'].includes(order.status)) throw invalidInput({ status: `A ${order.status.replace('_', ' ')} order cannot be cancelled` }, undefined, 409)
  if (order.status === 'awaiting_payment' && order.payment === 'card' && order.checkoutSessionId) {
    await usePayments().checkout.sessions.expire(order.checkoutSessionId).catch(() => null)
  }
  const refund = order.paidAt && order.payment === 'card' && order.paymentIntentId
  if (refund) {
    await usePayments().refunds.create({ payment_intent: order.paymentIntentId!, metadata: { orderId: String(order.id) } }, { idempotencyKey: `refund-order-${order.id}` })
  }
  await db.transaction(async (tx) => {
    const [r] = await tx.update(saleOrders).set({ status: refund ? 'refunded' : 'cancelled', closedAt: new Date() })
      .where(and(eq(saleOrders.id, orderId), inArray(saleOrders.status, ['awaiting_payment', 'paid', 'packed'])))
    if (r.affectedRows) await releaseStock(tx, orderId)
  })
  const [after] = await db.select().from(saleOrders).where(eq(saleOrders.id, orderId))
  return orderView(after!)
}

export interface AdminOrdersFilter { saleId?: number; status?: OrderStatus; pickupEventId?: number; paid?: 'yes' | 'no' }

export async function adminOrders(f: AdminOrdersFilter) {
  const sale = f.saleId ? await saleById(f.saleId) : await currentSale()
  if (!sale) return []
  const where: SQL[] = [eq(saleOrders.saleId, sale.id), sql`${saleOrders.status} <> 'cart'`]
  if (f.status) where.push(eq(saleOrders.status, f.status))
  if (f.pickupEventId) where.push(eq(saleOrders.pickupEventId, f.pickupEventId))
  if (f.paid === 'yes') where.push(isNotNull(saleOrders.paidAt), sql`${saleOrders.status} not in ('refunded')`)
  if (f.paid === 'no') where.push(isNull(saleOrders.paidAt))
  const rows = await useDb().select({ order: saleOrders, name: users.name, email: users.email, pickupAt: pickupEvents.startsAt, pickupPlace: pickupEvents.place })
    .from(saleOrders).innerJoin(users, eq(users.id, saleOrders.userId)).leftJoin(pickupEvents, eq(pickupEvents.id, saleOrders.pickupEventId))
    .where(and(...where)).orderBy(desc(saleOrders.id)).limit(2000)
  const counts = rows.length ? await useDb().select({ orderId: saleOrderItems.orderId, packets: sql<number>`sum(${saleOrderItems.quantity})` }).from(saleOrderItems)
    .where(inArray(saleOrderItems.orderId, rows.map((r) => r.order.id))).groupBy(saleOrderItems.orderId) : []
  const packets = new Map(counts.map((c) => [c.orderId, Number(c.packets)]))
  return rows.map(({ order: { checkoutSessionId: _c, paymentIntentId: _p, ...o }, ...r }) => ({ ...o, ...r, packets: packets.get(o.id) ?? 0 }))
}

/** Packets to pack for one pickup: totals by species (and collection), then each order's packets. */
export async function pickList(pickupEventId: number) {
  const db = useDb()
  const [event] = await db.select().from(pickupEvents).where(eq(pickupEvents.id, pickupEventId)).limit(1)
  if (!event) throw createError({ status: 404, message: 'No such pickup' })
  const [sale] = await db.select().from(seedSales).where(eq(seedSales.id, event.saleId))
  const rows = await db.select({ orderId: saleOrders.id, status: saleOrders.status, payment: saleOrders.payment, totalMinor: saleOrders.totalMinor, paidAt: saleOrders.paidAt, name: users.name, lotId: seedLots.id, scientificName: seedLots.scientificName, collected: seedLots.collected, quantity: saleOrderItems.quantity })
    .from(saleOrders).innerJoin(users, eq(users.id, saleOrders.userId)).innerJoin(saleOrderItems, eq(saleOrderItems.orderId, saleOrders.id)).innerJoin(seedLots, eq(seedLots.id, saleOrderItems.lotId))
    .where(and(eq(saleOrders.pickupEventId, pickupEventId), inArray(saleOrders.status, ['awaiting_payment', 'paid', 'packed'])))
    .orderBy(asc(seedLots.scientificName), asc(saleOrders.id))
  // card orders not yet paid are not packed
  const live = rows.filter((r) => r.paidAt || r.payment === 'at_pickup')
  const bySpecies = new Map<number, { scientificName: string; collected: string; packets: number }>()
  const byOrder = new Map<number, { orderId: number; name: string; status: string; payment: string | null; totalMinor: number; paid: boolean; lines: Array<{ scientificName: string; collected: string; quantity: number }> }>()
  for (const r of live) {
    const s = bySpecies.get(r.lotId) ?? { scientificName: r.scientificName, collected: r.collected, packets: 0 }
    s.packets += r.quantity
    bySpecies.set(r.lotId, s)
    const o = byOrder.get(r.orderId) ?? { orderId: r.orderId, name: r.name, status: r.status, payment: r.payment, totalMinor: r.totalMinor, paid: !!r.paidAt, lines: [] }
    o.lines.push({ scientificName: r.scientificName, collected: r.collected, quantity: r.quantity })
    byOrder.set(r.orderId, o)
  }
  return { event, currency: sale?.currency ?? 'usd', saleName: sale?.name ?? '', species: [...bySpecies.values()], orders: [...byOrder.values()].sort((a, b) => a.orderId - b.orderId) }
}
