import { z } from 'zod'
import { isoDate } from './common'
import { regionCode } from './common'
import { ORDER_STATUSES, DELIVERY_KINDS, PAYMENT_KINDS } from '../utils/labels'

// Bodies and queries of the seed sale and donations (pages validate their forms with the same schemas).
// Money is integer minor units (cents); the server computes every order amount from the lots.

const minor = (what: string, max = 10_000_000) => z.number({ error: `Give ${what} in cents` }).int(`${what} in whole cents`).min(0, `${what} cannot be negative`).max(max, `${what} looks too large`)
const currency = z.string().trim().toLowerCase().regex(/^[a-z]{3}$/, 'A three-letter currency code')
const id = z.number({ error: 'Choose one' }).int().positive('Choose one')

export const saleBody = z.object({
  name: z.string().trim().min(2, 'Name the sale').max(160),
  opensOn: isoDate,
  closesOn: isoDate,
  paused: z.boolean().default(false),
  currency: currency.default('usd'),
  mailEnabled: z.boolean().default(false),
  mailFeeMinor: minor('The mail fee', 100_000).default(0),
}).refine((b) => b.closesOn >= b.opensOn, { path: ['closesOn'], message: 'Closes on or after the day it opens' })

export const pickupEventBody = z.object({
  saleId: id,
  startsAt: z.string().regex(/^\d{4}-\d{2}-\d{2}[T ]\d{2}:\d{2}$/, 'Give a date and time'),
  place: z.string().trim().min(3, 'Say where').max(200),
})

const lotFields = {
  collected: z.string().trim().min(3, 'Say where and when the seed was collected').max(200),
  seedsPerPacket: z.number().int('Whole seeds').min(1, 'At least 1 seed').max(1_000_000).nullable(),
  packetMilligrams: z.number().int('Whole milligrams').min(1, 'At least 1 mg').max(1_000_000).nullable(),
  priceMinor: minor('The price', 1_000_000),
  stock: z.number({ error: 'Give the packets in stock' }).int('Whole packets').min(0, 'Stock cannot be negative').max(100_000),
  growingNotes: z.string().trim().max(2000).nullable(),
}

export const lotBody = z.object({
  saleId: id,
  scientificName: z.string().trim().min(3, 'Name the species').max(200),
  ...lotFields,
  seedsPerPacket: lotFields.seedsPerPacket.default(null),
  packetMilligrams: lotFields.packetMilligrams.default(null),
  growingNotes: lotFields.growingNotes.default(null),
}).refine((b) => b.seedsPerPacket !== null || b.packetMilligrams !== null, { path: ['seedsPerPacket'], message: 'Give seeds per packet or grams' })

/** A lot's changes: any of its fields but the sale and species. */
export const lotUpdateBody = z.object(lotFields).partial()

export const shopQuery = z.object({
  region: regionCode.optional(),
  sun: z.enum(['full', 'part', 'shade']).optional(),
  soil: z.enum(['sand', 'loam', 'clay']).optional(),
  moisture: z.enum(['dry', 'medium', 'wet']).optional(),
})

export const cartItemBody = z.object({
  lotId: id,
  quantity: z.number({ error: 'Give a number of packets' }).int('Whole packets').min(0, 'Packets cannot be negative').max(1000, 'At most 1,000 packets'),
})

export const cartFromPlanBody = z.object({ yardId: id })

export const checkoutBody = z.object({
  delivery: z.enum(DELIVERY_KINDS, { error: 'Choose pickup or mail' }),
  pickupEventId: id.nullable().default(null),
  mailingAddress: z.string().trim().max(500).nullable().default(null),
  payment: z.enum(PAYMENT_KINDS, { error: 'Choose how to pay' }),
}).superRefine((b, ctx) => {
  if (b.delivery === 'pickup' && !b.pickupEventId) ctx.addIssue({ code: 'custom', path: ['pickupEventId'], message: 'Choose a pickup' })
  if (b.delivery === 'mail' && (!b.mailingAddress || b.mailingAddress.length < 10)) ctx.addIssue({ code: 'custom', path: ['mailingAddress'], message: 'Give the full mailing address' })
  if (b.delivery === 'mail' && b.payment === 'at_pickup') ctx.addIssue({ code: 'custom', path: ['payment'], message: 'Mail orders are paid by card' })
})

export const DONATION_PRESETS_MINOR = [1000, 2500, 5000, 10000] as const
export const donationBody = z.object({
  amountMinor: z.number({ error: 'Choose or type an amount' }).int('Whole cents').min(100, 'At least $1.00').max(1_000_000, 'At most $10,000 online'),
  dedication: z.string().trim().max(200, 'At most 200 characters').nullable().default(null),
})

export const orderStatusBody = z.object({ status: z.enum(['packed', 'picked_up', 'sent'], { error: 'Packed, picked up or sent' }) })

export const adminOrdersQuery = z.object({
  status: z.enum(ORDER_STATUSES).optional(),
  pickupEventId: z.coerce.number().int().positive().optional(),
  paid: z.enum(['yes', 'no']).optional(),
  saleId: z.coerce.number().int().positive().optional(),
})

export const thankYouBody = z.object({
  subject: z.string().trim().min(3, 'Give a subject').max(200),
  body: z.string().trim().min(10, 'Write the message').max(5000),
})

export type SaleBody = z.infer<typeof saleBody>
export type LotBody = z.infer<typeof lotBody>
export type CheckoutBody = z.infer<typeof checkoutBody>
export type DonationBody = z.infer<typeof donationBody>
