import { z } from 'zod'
import { email, isoDate } from './common'

// Sharing, advice requests, site visits and recommendations: bodies and the recommendation format.

export const inviteBody = z.object({
  email,
  role: z.enum(['viewer', 'editor']).default('viewer'),
})

export const inviteTokenParam = z.object({ token: z.string().min(20).max(128) })
export const yardInviteParam = z.object({ id: z.coerce.number().int().positive(), inviteId: z.coerce.number().int().positive() })
export const yardMemberParam = z.object({ id: z.coerce.number().int().positive(), userId: z.coerce.number().int().positive() })

export const adviceRequestBody = z.object({
  message: z.string().trim().min(1, 'Say what you would like help with').max(4000),
  preferredTimes: z.string().trim().max(500).default(''),
})

export const adviceQueueQuery = z.object({
  status: z.enum(['new', 'assigned', 'closed', 'open', 'all']).default('open'),
})

export const assignBody = z.object({ advisorId: z.number().int().positive({ message: 'Choose an advisor' }) })
export const closeRequestBody = z.object({ note: z.string().trim().max(500).optional() })


// a TEXT column holds 65,535 bytes: 16,000 characters fit even when each takes utf8mb4's 4 bytes
const visitNotes = z.string().max(16_000, 'At most 16,000 characters')
export const visitBody = z.object({
  visitedOn: isoDate,
  notes: visitNotes.default(''),
})
export const visitUpdateBody = z.object({ notes: visitNotes })

const coord = z.number().min(-20_000).max(20_000)
export const pinBody = z.object({ x: coord, y: coord, comment: z.string().trim().min(1, 'Write a comment for the pin').max(1000) })
export const visitChildParam = z.object({ id: z.coerce.number().int().positive(), childId: z.coerce.number().int().positive() })

const species = z.string().trim().min(1, 'Name the species').max(200)
const cultivar = z.string().trim().max(120).nullable().optional()
const size = z.number().positive().max(60)
const point = z.tuple([coord, coord])

/** Replace planting X with species Y (same spot; a new size when the species grows differently). */
export const replaceChange = z.object({
  kind: z.literal('replace'),
  plantingId: z.string().min(1).max(64),
  species,
  cultivar,
  spread: size.optional(),
  height: size.optional(),
})

/** Add N plants of species Z in bed B (a clump at the bed's centre unless a spot is given). */
export const addChange = z.object({
  kind: z.literal('add'),
  bedId: z.string().min(1).max(64),
  species,
  cultivar,
  count: z.number().int().min(1, 'Add at least one plant').max(10_000),
  spread: size,
  height: size,
  x: coord.optional(),
  y: coord.optional(),
})

/** Turn an outlined area of lawn into a drift of species S, drawn above the lawn so it replaces it. */
export const convertLawnChange = z.object({
  kind: z.literal('convertLawn'),
  points: z.array(point).min(3, 'Outline the area with at least 3 points').max(200),
  species,
  spacing: z.number().positive().max(20),
  height: size,
})

export const recommendationChange = z.discriminatedUnion('kind', [replaceChange, addChange, convertLawnChange])
export type RecommendationChange = z.infer<typeof recommendationChange>

export const recommendationBody = z.object({ change: recommendationChange })
export const acceptBody = z.object({
  // the yard version the homeowner is looking at: a stale one gets 409
  version: z.number().int().positive(),
  // 'server' saves the changed document here; 'editor' only records the decision (the editor saved the plan)
  apply: z.enum(['server', 'editor']).default('server'),
})
export const declineBody = z.object({ reason: z.string().trim().min(1, 'Say in a word why not').max(500) })

export interface ShareFigures { native: number; total: number; share: number | null }
export interface ShareSet { count: ShareFigures; area: ShareFigures; volume: ShareFigures }
export interface PredictedShares { before: ShareSet; after: ShareSet }

/** A recommendation as GET /api/yards/[id]/advice lists it. */
export interface AdviceRecommendation {
  id: number
  visitId: number
  change: RecommendationChange
  summary: string
  predicted: PredictedShares
  basedOnVersion: number
  status: 'proposed' | 'accepted' | 'declined'
  declineReason: string | null
  advisorName: string
  visitedOn: string
  createdAt: string
}
