import { z } from 'zod'
import { isoDate } from './common'

// Pledge drives, pledges, the dashboard's table and bulk mail.
export const SHARE_KIND_OPTIONS = ['count', 'area', 'volume'] as const

export const driveBody = z.object({
  name: z.string().trim().min(1, 'Name the drive').max(160),
  startsOn: isoDate,
  endsOn: isoDate,
  goal: z.number().min(0.05, 'A goal between 0.05 and 1').max(1, 'A goal between 0.05 and 1').default(0.7),
  certifies: z.enum(SHARE_KIND_OPTIONS).default('area'),
  target: z.number().int().min(1, 'Aim for at least one yard').max(1_000_000),
}).refine((d) => d.endsOn >= d.startsOn, { path: ['endsOn'], message: 'The drive ends after it starts' })

/** `current` (the running drive) or a drive id. */
export const driveParam = z.object({ id: z.union([z.literal('current'), z.coerce.number().int().positive()]) })
export const driveMailingParam = z.object({ id: z.union([z.literal('current'), z.coerce.number().int().positive()]), mailingId: z.coerce.number().int().positive() })

export const pledgeBody = z.object({
  neighbourhood: z.string().trim().min(2, 'Give your neighbourhood or postal code').max(80),
  consent: z.boolean({ message: 'Say whether the yard may count in the totals' }),
})

export const PLEDGE_SORTS = ['pledgedOn', 'share', 'neighbourhood', 'status', 'change'] as const
export const pledgesQuery = z.object({
  sort: z.enum(PLEDGE_SORTS).default('pledgedOn'),
  dir: z.enum(['asc', 'desc']).default('desc'),
  status: z.enum(['pledged', 'reached', 'verified', 'any']).default('any'),
  neighbourhood: z.string().trim().max(80).optional(),
  minShare: z.coerce.number().min(0).max(1).optional(),
  maxShare: z.coerce.number().min(0).max(1).optional(),
  page: z.coerce.number().int().min(1).default(1),
  perPage: z.coerce.number().int().min(1).max(200).default(25),
})
export type PledgesQuery = z.infer<typeof pledgesQuery>

export const mailingBody = z.object({
  kind: z.enum(['reminder', 'thanks']),
  audience: z.enum(['all', 'pledged', 'reached', 'verified']).default('all'),
  subject: z.string().trim().min(1, 'Give the e-mail a subject').max(200),
  body: z.string().trim().min(1, 'Write the message').max(10_000),
})
