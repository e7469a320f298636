import { mysqlTable, varchar, text, int, boolean, date, datetime, timestamp, char, mysqlEnum, index, uniqueIndex } from 'drizzle-orm/mysql-core'
import { id, ref, timestamps } from './columns'
import { users } from './accounts'
import { ORDER_STATUSES, DONATION_STATUSES, DELIVERY_KINDS, PAYMENT_KINDS } from '../../../shared/utils/labels'

// The organisation's seed sale and donations. Money is integer minor units (cents) beside a currency code.

/** A season's sale: open from `opensOn` to `closesOn` (inclusive) unless paused. */
export const seedSales = mysqlTable('seed_sales', {
  id: id(),
  name: varchar('name', { length: 160 }).notNull(),
  opensOn: date('opens_on', { mode: 'string' }).notNull(),
  closesOn: date('closes_on', { mode: 'string' }).notNull(),
  paused: boolean('paused').notNull().default(false),
  currency: char('currency', { length: 3 }).notNull().default('usd'),
  mailEnabled: boolean('mail_enabled').notNull().default(false),
  mailFeeMinor: int('mail_fee_minor', { unsigned: true }).notNull().default(0),
  ...timestamps,
}, (t) => [index('seed_sales_dates_idx').on(t.opensOn, t.closesOn)])

/** Where and when buyers collect their packets. */
export const pickupEvents = mysqlTable('pickup_events', {
  id: id(),
  saleId: ref('sale_id').notNull().references(() => seedSales.id, { onDelete: 'cascade' }),
  startsAt: datetime('starts_at', { mode: 'string' }).notNull(),
  place: varchar('place', { length: 200 }).notNull(),
  ...timestamps,
}, (t) => [index('pickup_events_sale_idx').on(t.saleId, t.startsAt)])

/** A lot of seed for sale: `stock` is the packets not yet held by any checkout. */
export const seedLots = mysqlTable('seed_lots', {
  id: id(),
  saleId: ref('sale_id').notNull().references(() => seedSales.id, { onDelete: 'cascade' }),
  speciesKey: varchar('species_key', { length: 200 }).notNull(),
  scientificName: varchar('scientific_name', { length: 200 }).notNull(),
  collected: varchar('collected', { length: 200 }).notNull(),
  seedsPerPacket: int('seeds_per_packet', { unsigned: true }),
  // packet weight in milligrams when a packet is sold by weight
  packetMilligrams: int('packet_milligrams', { unsigned: true }),
  priceMinor: int('price_minor', { unsigned: true }).notNull(),
  stock: int('stock', { unsigned: true }).notNull(),
  // null: the catalogue's treatment in words
  growingNotes: text('growing_notes'),
  ...timestamps,
}, (t) => [uniqueIndex('seed_lots_sale_species_collected_unique').on(t.saleId, t.speciesKey, t.collected)])

export const saleOrders = mysqlTable('sale_orders', {
  id: id(),
  userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  saleId: ref('sale_id').notNull().references(() => seedSales.id, { onDelete: 'cascade' }),
  status: mysqlEnum('status', ORDER_STATUSES).notNull().default('cart'),
  delivery: mysqlEnum('delivery', DELIVERY_KINDS),
  pickupEventId: ref('pickup_event_id').references(() => pickupEvents.id, { onDelete: 'restrict' }),
  mailingAddress: text('mailing_address'),
  payment: mysqlEnum('payment', PAYMENT_KINDS),
  currency: char('currency', { length: 3 }).notNull(),
  subtotalMinor: int('subtotal_minor', { unsigned: true }).notNull().default(0),
  deliveryFeeMinor: int('delivery_fee_minor', { unsigned: true }).notNull().default(0),
  totalMinor: int('total_minor', { unsigned: true }).notNull().default(0),
  // true while the order's packets are taken out of the lots' stock
  stockHeld: boolean('stock_held').notNull().default(false),
  checkoutSessionId: varchar('checkout_session_id', { length: 255 }),
  paymentIntentId: varchar('payment_intent_id', { length: 255 }),
  placedAt: timestamp('placed_at', { fsp: 3 }),
  paidAt: timestamp('paid_at', { fsp: 3 }),
  closedAt: timestamp('closed_at', { fsp: 3 }),
  ...timestamps,
}, (t) => [
  uniqueIndex('sale_orders_session_unique').on(t.checkoutSessionId),
  index('sale_orders_user_idx').on(t.userId, t.status),
  index('sale_orders_sale_status_idx').on(t.saleId, t.status),
  index('sale_orders_payment_intent_idx').on(t.paymentIntentId),
])

export const saleOrderItems = mysqlTable('sale_order_items', {
  id: id(),
  orderId: ref('order_id').notNull().references(() => saleOrders.id, { onDelete: 'cascade' }),
  lotId: ref('lot_id').notNull().references(() => seedLots.id, { onDelete: 'restrict' }),
  quantity: int('quantity', { unsigned: true }).notNull(),
  // fixed when checkout starts; the lot's price while in the cart
  unitPriceMinor: int('unit_price_minor', { unsigned: true }).notNull(),
  ...timestamps,
}, (t) => [uniqueIndex('sale_order_items_order_lot_unique').on(t.orderId, t.lotId), index('sale_order_items_lot_idx').on(t.lotId)])

export const donations = mysqlTable('donations', {
  id: id(),
  userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  amountMinor: int('amount_minor', { unsigned: true }).notNull(),
  currency: char('currency', { length: 3 }).notNull(),
  dedication: varchar('dedication', { length: 200 }),
  status: mysqlEnum('status', DONATION_STATUSES).notNull().default('awaiting_payment'),
  checkoutSessionId: varchar('checkout_session_id', { length: 255 }),
  paymentIntentId: varchar('payment_intent_id', { length: 255 }),
  paidAt: timestamp('paid_at', { fsp: 3 }),
  ...timestamps,
}, (t) => [uniqueIndex('donations_session_unique').on(t.checkoutSessionId), index('donations_user_idx').on(t.userId), index('donations_paid_idx').on(t.status, t.paidAt)])

/** Every payment-service event handled, by its id: a redelivered event is recognised and changes nothing. */
export const paymentEvents = mysqlTable('payment_events', {
  id: id(),
  eventId: varchar('event_id', { length: 255 }).notNull(),
  type: varchar('type', { length: 80 }).notNull(),
  ...timestamps,
}, (t) => [uniqueIndex('payment_events_event_unique').on(t.eventId)])

/** The coordinator's thank-you mail for donations (one row; placeholders {name}, {amount}, {dedication}). */
export const thankYouTemplates = mysqlTable('thank_you_templates', {
  id: id(),
  subject: varchar('subject', { length: 200 }).notNull(),
  body: text('body').notNull(),
  ...timestamps,
})
