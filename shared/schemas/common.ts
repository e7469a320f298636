import { z } from 'zod'
import { isMonthDay } from '../utils/seed-season'

/** ISO 3166-2 code of a US state/territory or Canadian province/territory, e.g. US-OH, CA-ON. */
export const regionCode = z.string().regex(/^(US|CA)-[A-Z]{2}$/, 'Use a state or province code such as US-OH or CA-ON')

/** USDA hardiness zone with half-zone, the range of the USDA 2023 map: 1a … 13b (other countries' zone maps use other scales). */
export const hardinessZone = z.string().trim().toLowerCase().regex(/^(1[0-3]|[1-9])[ab]$/, 'Use a USDA hardiness zone from 1a to 13b, such as 6a')

/** A real day of the year as MM-DD (frost dates repeat every year; 02-29 counts, 02-30 and 04-31 do not). */
export const monthDay = z.string().regex(/^\d\d-\d\d$/, 'Use MM-DD, e.g. 04-28').refine(isMonthDay, 'Not a day of the year: use MM-DD, e.g. 04-28')

export const idParam = z.object({ id: z.coerce.number().int().positive() })

export const email = z.string().trim().toLowerCase().email('Enter a valid e-mail address').max(254)
