import { z } from 'zod'
import { isoDate } from './common'

// Bodies and queries of the grow-from-seed routes (the page validates its forms with the same schemas).

export const seedPlanQuery = z.object({
  // for planning ahead (and tests): the day the coming season is counted from; default today
  today: isoDate.optional(),
})

export const speciesSetting = z.object({
  grow: z.boolean().optional(),
  seedlingsPerPot: z.number().int('Whole seedlings').min(1, 'At least 1 seedling a pot').max(100, 'At most 100 seedlings a pot').nullable().optional(),
})

export const updateSeedPlanBody = z.object({
  // the version edited; 0 while the yard has no saved seed plan
  version: z.number().int().min(0),
  margin: z.number().min(0, 'The margin is 0 % or more').max(2, 'The margin is at most 200 %').optional(),
  // by scientific name; a species not named keeps its setting
  species: z.record(z.string().trim().min(1).max(200), speciesSetting).optional()
    .refine((r) => !r || Object.keys(r).length <= 2000, 'Too many species'),
})

export const seedReminderBody = z.object({
  enabled: z.boolean(),
  leadDays: z.number().int().min(0, 'From 0 days').max(14, 'At most 14 days ahead').optional(),
})

export const seedPriceBody = z.object({
  scientificName: z.string().trim().min(3, 'Name the species').max(200),
  // per gram; null removes the price
  pricePerGram: z.number().positive('A price above 0').max(100_000, 'That price looks wrong').nullable(),
})

export const unsubscribeQuery = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{20,64}$/, 'Not a valid link') })

export type UpdateSeedPlanBody = z.infer<typeof updateSeedPlanBody>
export type SeedPriceBody = z.infer<typeof seedPriceBody>
