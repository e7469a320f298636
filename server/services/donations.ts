// Donations through the hosted checkout, and the coordinator's list, totals and CSV.
import { and, desc, eq, isNotNull } from 'drizzle-orm'
import Papa from 'papaparse'
import { donations, users } from '../database/schema'
import type { AccountRow } from '../database/schema'
import type { DonationBody } from '#shared/schemas/sale'
import { sumByCurrency, formatMoney } from '#shared/utils/money'
import { label } from '#shared/utils/labels'

export async function startDonation(user: AccountRow, body: DonationBody) {
  const currency = useRuntimeConfig().payments.currency || 'usd'
  const db = useDb()
  const id = insertedId(await db.insert(donations).values({ userId: user.id, amountMinor: body.amountMinor, currency, dedication: body.dedication || null }).$returningId())
  try {
    const session = await usePayments().checkout.sessions.create({
      mode: 'payment',
      line_items: [{ quantity: 1, price_data: { currency, unit_amount: body.amountMinor, product_data: { name: body.dedication ? `Donation, ${body.dedication}` : 'Donation' } } }],
      client_reference_id: `donation-${id}`,
      customer_email: user.email,
      metadata: { kind: 'donation', donationId: String(id) },
      success_url: appLink(`/donate?thanks=${id}`),
      cancel_url: appLink('/donate?cancelled=1'),
    }, { idempotencyKey: `donation-${id}` })
    await db.update(donations).set({ checkoutSessionId: session.id }).where(eq(donations.id, id))
    return { donationId: id, url: session.url }
  } catch (e) {
    await db.update(donations).set({ status: 'cancelled' }).where(eq(donations.id, id))
    throw createError({ status: 502, message: `The payment service did not answer; nothing was charged. ${(e as Error).message}` })
  }
}

const publicRow = ({ checkoutSessionId: _c, paymentIntentId: _p, ...d }: typeof donations.$inferSelect) => d

export async function myDonations(user: AccountRow) {
  const rows = await useDb().select().from(donations).where(and(eq(donations.userId, user.id), isNotNull(donations.checkoutSessionId))).orderBy(desc(donations.id))
  return rows.map(publicRow)
}

export async function allDonations() {
  const rows = await useDb().select({ d: donations, name: users.name, email: users.email }).from(donations).innerJoin(users, eq(users.id, donations.userId))
    .where(isNotNull(donations.checkoutSessionId)).orderBy(desc(donations.id)).limit(5000)
  const list = rows.map((r) => ({ ...publicRow(r.d), name: r.name, email: r.email }))
  const paid = list.filter((d) => d.status === 'paid')
  return { donations: list, totals: { count: paid.length, byCurrency: sumByCurrency(paid.map((d) => ({ amountMinor: d.amountMinor, currency: d.currency }))) } }
}

export async function donationsCsv() {
  const { donations: list } = await allDonations()
  return Papa.unparse({
    fields: ['id', 'date', 'name', 'email', 'amount', 'currency', 'status', 'dedication'],
    data: list.map((d) => [d.id, (d.paidAt ?? d.createdAt).toISOString().slice(0, 10), d.name, d.email, formatMoney(d.amountMinor, d.currency), d.currency.toUpperCase(), label('donationStatus', d.status), d.dedication ?? '']),
  }, { escapeFormulae: true })
}
