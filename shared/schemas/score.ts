import { z } from 'zod'
import { LAYERS } from '../types/species'
import { MAX_AREAS, MAX_PLANTINGS, yardArea, yardDocument, yardDocumentFields, yardPlanting, type YardDocument } from './yard-document'

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
})

export const scoreSchema = z.strictObject({
  goal: z.number(),
  shares: sharesSchema,
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

// ---------- re-scoring after an edit ----------
// The editor's first request posts the whole document; the answer carries a `basis`, a handle on the server's
// copy of that document. Later requests send `{ basis, changes }` and get back only the planting lines that
// changed; a basis the server no longer holds answers 409 and the editor posts the whole document again.

const listChanges = <T extends z.ZodType>(item: T, max: number) => z.strictObject({
  upsert: z.array(item).max(max).optional(),
  remove: z.array(z.string().min(1).max(64)).max(max).optional(),
})

export const yardChangesSchema = z.strictObject({
  fields: yardDocumentFields.optional(),
  areas: listChanges(yardArea, MAX_AREAS).optional(),
  plantings: listChanges(yardPlanting, MAX_PLANTINGS).optional(),
})

export const scoreBasis = z.string().regex(/^[A-Za-z0-9_-]{16,64}$/, 'Not a score basis')

export const scoreChangesRequest = z.strictObject({ basis: scoreBasis, changes: yardChangesSchema })

/** POST /api/score's body: a whole yard document, or changes to one the server scored before. */
export const scoreRequest = z.custom<unknown>(() => true).transform((value, ctx) => {
  const isChanges = typeof value === 'object' && value !== null && 'basis' in value
  const result = isChanges ? scoreChangesRequest.safeParse(value) : yardDocument.safeParse(value)
  if (!result.success) {
    for (const issue of result.error.issues) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message, input: value })
    return z.NEVER
  }
  return isChanges
    ? { kind: 'changes' as const, ...(result.data as z.output<typeof scoreChangesRequest>) }
    : { kind: 'document' as const, doc: result.data as YardDocument }
})

export type ScoreRequest = z.output<typeof scoreRequest>

/** The answer to a whole document: the score and the basis for the next request's changes. */
export const scoreWithBasisSchema = scoreSchema.extend({ basis: scoreBasis })

/**
 * The answer to changes: the whole score except `plantings`, which lists only lines that are new or differ from
 * the answer for `since`; `removedPlantings` names lines to drop.
 */
export const scoreUpdateSchema = scoreWithBasisSchema.extend({ since: scoreBasis, removedPlantings: z.array(z.string()) })

export type ScoreWithBasis = z.infer<typeof scoreWithBasisSchema>
export type ScoreUpdate = z.infer<typeof scoreUpdateSchema>
