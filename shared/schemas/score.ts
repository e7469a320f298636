import { z } from 'zod'
import { LAYERS, type SpeciesFacts } from '../types/species'
import { regionCode } from './common'
import { MAX_PLANTINGS } from './yard-document'
import { GOAL_MAX, GOAL_MIN } from '../utils/score/goal'

// The score of a yard, as POST /api/score and GET /api/yards/[id]/score answer it. Areas in m², volumes in m³.

export const SHARE_KINDS = ['count', 'area', 'volume'] as const
export type ShareKind = (typeof SHARE_KINDS)[number]

export const SCORE_STATUSES = ['native', 'introduced', 'invasive', 'nativeAndIntroduced', 'unknown'] as const
export const MOVE_KINDS = ['replace-invasive', 'convert-lawn', 'add-plants'] as const
export type MoveKind = (typeof MOVE_KINDS)[number]

/** native / total, and the share (null when there is nothing to share). */
export const shareSchema = z.strictObject({ native: z.number(), total: z.number(), share: z.number().nullable() })
export const sharesSchema = z.strictObject({ count: shareSchema, area: shareSchema, volume: shareSchema })
export const totalsSchema = z.strictObject({ count: z.number(), area: z.number(), volume: z.number() })

export const scoredPlantingSchema = z.strictObject({
  id: z.string(),
  status: z.enum(SCORE_STATUSES),
  layer: z.enum(LAYERS),
  /** plants (null for a sown or sodded area: it is left out of the count share) */
  count: z.number().nullable(),
  area: z.number(),
  volume: z.number(),
  cultivar: z.boolean(),
})

export const moveSchema = z.strictObject({
  share: z.enum(SHARE_KINDS),
  kind: z.enum(MOVE_KINDS),
  amount: z.number(),
  unit: z.enum(['m2', 'plants']),
  text: z.string(),
  /** replace-invasive: the ids of the plantings it replaces */
  plantings: z.array(z.string()).optional(),
  /** add-plants: the layer of the plants it adds (sized as the engine's typical plant of that layer) */
  layer: z.enum(LAYERS).optional(),
})

export const scoreSchema = z.strictObject({
  goal: z.number(),
  /** the plan's shares (there now + to plant), as `planned` */
  shares: sharesSchema,
  /** the yard as it is now: there now + to remove */
  now: sharesSchema,
  /** with the plan: there now + to plant (at `years` after planting; null: at maturity) */
  planned: sharesSchema,
  years: z.number().nullable(),
  byStatus: z.strictObject({
    native: totalsSchema, introduced: totalsSchema, invasive: totalsSchema, nativeAndIntroduced: totalsSchema, unknown: totalsSchema,
  }),
  straightSpecies: sharesSchema,
  plantings: z.array(scoredPlantingSchema),
  moves: z.array(moveSchema),
  warnings: z.array(z.strictObject({ id: z.string(), message: z.string() })),
})

export type Share = z.infer<typeof shareSchema>
export type Shares = z.infer<typeof sharesSchema>
export type Totals = z.infer<typeof totalsSchema>
export type ScoredPlanting = z.infer<typeof scoredPlantingSchema>
export type Move = z.infer<typeof moveSchema>
export type ScoreWarning = z.infer<typeof scoreSchema>['warnings'][number]
export type Score = z.infer<typeof scoreSchema>

// ---------- what the editor needs to score in the browser ----------

/** POST /api/species/facts: the facts of these species names in a region (a region change, a name not seen yet). */
export const speciesFactsBody = z.strictObject({
  region: regionCode,
  names: z.array(z.string().trim().min(1).max(200)).min(1).max(MAX_PLANTINGS),
})

/** The facts and the goal the engine needs: facts keyed by `nameKey` (names not in the catalogue are absent). */
export interface ScoreInputs {
  region: string | null
  goal: number
  facts: Record<string, SpeciesFacts>
}

/** PUT /api/organisation/goal: the coordinator's goal share. */
export const organisationGoalBody = z.strictObject({
  goal: z.number({ error: 'Enter the goal as a number between 0.50 and 1.00' }).min(GOAL_MIN, 'The goal is at least 0.50 (50 %)').max(GOAL_MAX, 'The goal is at most 1.00 (100 %)'),
})
