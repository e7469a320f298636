import { z } from 'zod'

/** ISO 3166-2 code of a US state/territory or Canadian province/territory, e.g. US-OH, CA-ON. */
export const regionCode = z.string().regex(/^(US|CA)-[A-Z]{2}$/, 'Use a state or province code such as US-OH or CA-ON')

/** USDA hardiness zone with half-zone, the range of the USDA 2023 map: 1a … 13b (other countries' zone maps use other scales). */
export const hardinessZone = z.string().trim().toLowerCase().regex(/^(1[0-3]|[1-9])[ab]$/, 'Use a USDA hardiness zone from 1a to 13b, such as 6a')

/** A day of the year as MM-DD (frost dates repeat every year); 02-29 is allowed, 02-30 is not. */
export const monthDay = z.string().regex(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, 'Use MM-DD, e.g. 04-28')
  .refine((s) => isRealDate(2024, Number(s.slice(0, 2)), Number(s.slice(3, 5))), 'That day does not exist')

function isRealDate(y: number, m: number, d: number): boolean {
  const t = new Date(Date.UTC(y, m - 1, d))
  return t.getUTCFullYear() === y && t.getUTCMonth() === m - 1 && t.getUTCDate() === d
}

/** The one calendar-date schema: YYYY-MM-DD naming a day that exists, in MariaDB's DATE range (years 1000–9999). */
export const isoDate = z.string().regex(/^[1-9]\d{3}-\d{2}-\d{2}$/, 'Use a date such as 2026-05-14')
  .refine((s) => isRealDate(Number(s.slice(0, 4)), Number(s.slice(5, 7)), Number(s.slice(8, 10))), 'That day does not exist')

export const idParam = z.object({ id: z.coerce.number().int().positive() })

export const email = z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254)
