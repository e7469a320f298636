import { z } from 'zod'
import { regionCode, isoDate } from './common'
import { yardDocument } from './yard-document'

const yardName = z.string().trim().min(1, 'Give the yard a name').max(120)

export const createYardBody = z.object({
  name: yardName,
  region: regionCode,
  document: yardDocument.optional(),
})

export const updateYardBody = z.object({
  version: z.number().int().positive(),
  name: yardName.optional(),
  document: yardDocument.optional(),
})

export type CreateYardBody = z.infer<typeof createYardBody>
export type UpdateYardBody = z.infer<typeof updateYardBody>

// ---------- work marked done ----------

export const WORK_ACTIONS = ['planted', 'removed'] as const
export type WorkAction = (typeof WORK_ACTIONS)[number]

/** Today as YYYY-MM-DD in UTC (west of Greenwich the local date is never ahead of it). */
export const todayIso = () => new Date().toISOString().slice(0, 10)

/** POST /api/yards/[id]/work: plantings or areas planted (to plant → there now) or removed (to remove → gone) on a date. */
export const markWorkBody = z.strictObject({
  version: z.number({ error: 'The version of the plan is missing' }).int().positive(),
  action: z.enum(WORK_ACTIONS, { error: 'Choose planted or removed' }),
  ids: z.array(z.string().min(1).max(64)).min(1, 'Choose at least one planting or area').max(5000),
  date: isoDate.refine((d) => d <= todayIso(), 'Work cannot be marked done on a date in the future'),
})
export type MarkWorkBody = z.infer<typeof markWorkBody>
