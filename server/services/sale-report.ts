// The coordinator's figures: stock and revenue by species, money by day (orders beside donations), orders CSV.
import { and, asc, eq, inArray, isNotNull, sql } from 'drizzle-orm'
import Papa from 'papaparse'
import { saleOrders, saleOrderItems, seedLots, donations } from '../database/schema'
import { adminOrders, type AdminOrdersFilter } from './sale-orders'
import { formatMoney, sumByCurrency } from '#shared/utils/money'
import { label } from '#shared/utils/labels'

const SOLD = ['awaiting_payment', 'paid', 'packed', 'picked_up', 'sent'] as const
const PAID = ['paid', 'packed', 'picked_up', 'sent'] as const

/** Per lot: packets left, packets spoken for, packets paid for and their revenue (minor units). */
export async function stockAndRevenue(saleId: number) {
  const db = useDb()
  const lots = await db.select().from(seedLots).where(eq(seedLots.saleId, saleId)).orderBy(asc(seedLots.scientificName))
  const sold = await db.select({
    lotId: saleOrderItems.lotId,
    ordered: sql<number>`sum(${saleOrderItems.quantity})`,
    paidPackets: sql<number>`sum(case when ${saleOrders.paidAt} is not null and ${inArray(saleOrders.status, [...PAID])} then ${saleOrderItems.quantity} else 0 end)`,
    revenue: sql<number>`sum(case when ${saleOrders.paidAt} is not null and ${inArray(saleOrders.status, [...PAID])} then ${saleOrderItems.quantity} * ${saleOrderItems.unitPriceMinor} else 0 end)`,
  }).from(saleOrderItems).innerJoin(saleOrders, eq(saleOrders.id, saleOrderItems.orderId))
    .where(and(eq(saleOrders.saleId, saleId), inArray(saleOrders.status, [...SOLD]))).groupBy(saleOrderItems.lotId)
  const by = new Map(sold.map((s) => [s.lotId, s]))
  return lots.map((l) => ({
    lotId: l.id, scientificName: l.scientificName, collected: l.collected, priceMinor: l.priceMinor, stock: l.stock,
    ordered: Number(by.get(l.id)?.ordered ?? 0), paidPackets: Number(by.get(l.id)?.paidPackets ?? 0), revenueMinor: Number(by.get(l.id)?.revenue ?? 0),
  }))
}

/** Money received per day: seed orders (less refunds) and donations, in minor units. */
export async function moneyByDay(saleId: number) {
  const db = useDb()
  const orders = await db.select({ day: sql<string>`date_format(${saleOrders.paidAt}, '%Y-%m-%d')`, currency: saleOrders.currency, total: sql<number>`sum(${saleOrders.totalMinor})` })
    .from(saleOrders).where(and(eq(saleOrders.saleId, saleId), isNotNull(saleOrders.paidAt), inArray(saleOrders.status, [...PAID])))
    .groupBy(sql`1`, saleOrders.currency).orderBy(sql`1`)
  const gifts = await db.select({ day: sql<string>`date_format(${donations.paidAt}, '%Y-%m-%d')`, currency: donations.currency, total: sql<number>`sum(${donations.amountMinor})` })
    .from(donations).where(and(eq(donations.status, 'paid'), isNotNull(donations.paidAt))).groupBy(sql`1`, donations.currency).orderBy(sql`1`)
  const days = [...new Set([...orders, ...gifts].map((r) => r.day))].sort()
  const at = (rows: typeof orders, day: string) => Number(rows.find((r) => r.day === day)?.total ?? 0)
  return {
    days,
    orders: days.map((d) => at(orders, d)),
    donations: days.map((d) => at(gifts, d)),
    totals: {
      orders: sumByCurrency(orders.map((r) => ({ amountMinor: Number(r.total), currency: r.currency }))),
      donations: sumByCurrency(gifts.map((r) => ({ amountMinor: Number(r.total), currency: r.currency }))),
    },
  }
}

export async function ordersCsv(filter: AdminOrdersFilter) {
  const rows = await adminOrders(filter)
  return Papa.unparse({
    fields: ['order', 'placed', 'name', 'email', 'status', 'delivery', 'pickup', 'payment', 'packets', 'total', 'currency', 'paid'],
    data: rows.map((o) => [o.id, o.placedAt?.toISOString().slice(0, 16).replace('T', ' ') ?? '', o.name, o.email, label('orderStatus', o.status), label('delivery', o.delivery),
      o.pickupAt ? `${o.pickupAt.slice(0, 16)} ${o.pickupPlace}` : '', label('payment', o.payment), o.packets, formatMoney(o.totalMinor, o.currency), o.currency.toUpperCase(), o.paidAt ? 'yes' : 'no']),
  }, { escapeFormulae: true })
}
