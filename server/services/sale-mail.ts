// E-mail receipts for seed orders (with how to sow each packet) and donations (the coordinator's thank-you).
import { eq } from 'drizzle-orm'
import { saleOrders, donations, users, thankYouTemplates } from '../database/schema'
import { formatMoney } from '#shared/utils/money'
import { label } from '#shared/utils/labels'

export const DEFAULT_THANK_YOU = {
  subject: 'Thank you for your gift to our native yards group',
  body: 'Dear {name},\n\nThank you for your gift of {amount}{dedication}. It pays for seed collecting, pots and soil for our volunteers, and our plant sales.\n\nWith thanks from all of us.',
}

export async function thankYouTemplate() {
  const [row] = await useDb().select().from(thankYouTemplates).limit(1)
  return row ? { subject: row.subject, body: row.body } : DEFAULT_THANK_YOU
}

export async function saveThankYouTemplate(t: { subject: string; body: string }) {
  const db = useDb()
  await db.insert(thankYouTemplates).values({ id: 1, ...t }).onDuplicateKeyUpdate({ set: t })
  return thankYouTemplate()
}

export function fillTemplate(text: string, values: Record<string, string>): string {
  return text.replace(/\{(name|amount|dedication)\}/g, (_, k: string) => values[k] ?? '')
}

export async function sendOrderReceipt(orderId: number) {
  const { orderView } = await import('./sale-orders')
  const [order] = await useDb().select().from(saleOrders).where(eq(saleOrders.id, orderId))
  if (!order) return
  const view = await orderView(order)
  if (!view.buyer) return
  const money = (m: number) => formatMoney(m, order.currency)
  const where = view.pickup ? `Pick up: ${view.pickup.startsAt.slice(0, 16).replace('T', ' ')} at ${view.pickup.place}.` : `By mail to:\n${order.mailingAddress ?? ''}`
  const paid = order.paidAt ? `Paid by card: ${money(order.totalMinor)}.` : `To pay at pickup: ${money(order.totalMinor)}.`
  const lines = view.lines.map((l) => `${l.quantity} × ${l.lot.scientificName}${l.lot.commonName ? ` (${l.lot.commonName})` : ''}, ${l.lot.contents} a packet, ${l.lot.collected}: ${money(l.quantity * l.unitPriceMinor)}`)
  const sowing = view.lines.map((l) => [`${l.lot.scientificName}: ${l.lot.treatment}`, ...l.lot.sowingSteps.map((s, i) => `  ${i + 1}. ${s}`)].join('\n'))
  const text = [
    `Hello ${view.buyer.name},`, '',
    `Your seed order ${order.id} from ${view.sale.name} (${label('orderStatus', order.status)}).`, '',
    ...lines,
    order.deliveryFeeMinor ? `Mail delivery: ${money(order.deliveryFeeMinor)}` : '',
    `Total: ${money(order.totalMinor)}`, paid, '', where, '',
    'How to sow each packet', '', ...sowing, '',
    `Your orders: ${appLink('/sale/orders')}`,
  ].filter((l, i, a) => l !== '' || a[i - 1] !== '').join('\n')
  await sendMail({ to: view.buyer.email, subject: `Your seed order ${order.id}: receipt`, text })
}

export async function sendDonationReceipt(donationId: number) {
  const [row] = await useDb().select({ d: donations, name: users.name, email: users.email }).from(donations).innerJoin(users, eq(users.id, donations.userId)).where(eq(donations.id, donationId))
  if (!row) return
  const t = await thankYouTemplate()
  const values = { name: row.name, amount: formatMoney(row.d.amountMinor, row.d.currency), dedication: row.d.dedication ? `, dedicated ${row.d.dedication}` : '' }
  const text = `${fillTemplate(t.body, values)}\n\nReceipt: donation ${row.d.id}, ${values.amount}, received ${row.d.paidAt?.toISOString().slice(0, 10) ?? ''}.${row.d.dedication ? `\nDedication: ${row.d.dedication}` : ''}\n`
  await sendMail({ to: row.email, subject: fillTemplate(t.subject, values), text })
}
