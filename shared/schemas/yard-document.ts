import { z } from 'zod'
import { firstSelfIntersection, type Point } from '../utils/polygon'
import { regionCode, hardinessZone, monthDay } from './common'

// The yard document: our own JSON format (format tag "wildward.yard/1"), stored per yard and used for export
// and import. All lengths in metres, x to the right and y down, origin at the lot's top-left.

export const YARD_FORMAT = 'wildward.yard/1'
export const MAX_PLANTINGS = 5000
export const MAX_AREAS = 2000
const MAX_VERTICES = 1000
// a lot larger than about 20 km across is a mistake in units, not a yard
const MAX_COORD = 20_000

const coord = z.number().min(-MAX_COORD).max(MAX_COORD)
const point = z.tuple([coord, coord])
const elementId = z.string().min(1).max(64)

const ring = z.array(point).min(3, 'A shape needs at least 3 points').max(MAX_VERTICES)
  .superRefine((pts, ctx) => {
    if (pts.length < 3) return
    const edge = firstSelfIntersection(pts as Point[])
    if (edge >= 0) ctx.addIssue({ code: 'custom', message: `The outline crosses itself (edge ${edge + 1}) or has no area` })
  })

export const AREA_KINDS = ['building', 'paving', 'bed', 'water'] as const
export const SUN = ['full', 'part', 'shade'] as const
export const SOIL = ['sand', 'loam', 'clay'] as const
export const MOISTURE = ['dry', 'medium', 'wet'] as const

export const yardArea = z.object({
  id: elementId,
  kind: z.enum(AREA_KINDS),
  z: z.number().int().min(-1_000_000).max(1_000_000).default(0),
  points: ring,
  sun: z.enum(SUN).optional(),
  soil: z.enum(SOIL).optional(),
  moisture: z.enum(MOISTURE).optional(),
  label: z.string().max(200).optional(),
})

export const yardPlanting = z.object({
  id: elementId,
  species: z.string().trim().min(1).max(200).nullable(),
  cultivar: z.string().trim().max(120).nullable().optional(),
  label: z.string().max(200).optional(),
  // a point planting: one plant or a clump of `count` plants
  x: coord.optional(),
  y: coord.optional(),
  count: z.number().int().min(1, 'A count is at least 1').max(100_000).optional(),
  spread: z.number().positive().max(60).optional(),
  // an area planting (drift, meadow, groundcover, lawn); spacing null means sown or sodded (no plant count)
  z: z.number().int().min(-1_000_000).max(1_000_000).optional(),
  points: ring.optional(),
  spacing: z.number().positive().max(20).nullable().optional(),
  height: z.number().positive().max(120).optional(),
}).superRefine((p, ctx) => {
  const isPoint = p.x !== undefined || p.y !== undefined
  if (isPoint && p.points) ctx.addIssue({ code: 'custom', message: 'A planting is either a point (x, y) or an area (points), not both' })
  else if (isPoint && (p.x === undefined || p.y === undefined)) ctx.addIssue({ code: 'custom', path: [p.x === undefined ? 'x' : 'y'], message: 'A point planting needs both x and y' })
  else if (!isPoint && !p.points) ctx.addIssue({ code: 'custom', message: 'A planting needs a position (x, y) or an outline (points)' })
})

/**
 * An element of a list whose errors name it: the path stays `plantings.3.points`, the message gains
 * `Planting "p4": …`, so a 400 for a yard of a thousand plantings says which one is wrong.
 */
function named<S extends z.ZodType>(schema: S, noun: string) {
  return z.custom<z.input<S>>(() => true).transform((value, ctx): z.output<S> => {
    const result = schema.safeParse(value)
    if (result.success) return result.data
    const id = typeof (value as { id?: unknown } | null)?.id === 'string' ? (value as { id: string }).id : null
    for (const issue of result.error.issues) {
      ctx.addIssue({ code: 'custom', path: issue.path as PropertyKey[], message: `${noun}${id ? ` "${id}"` : ''}: ${issue.message}`, input: value })
    }
    return z.NEVER
  })
}

export const yardLine = z.object({
  id: elementId,
  // overhead wires and buried services drive the cautions about trees and digging
  kind: z.enum(['overhead', 'buried']),
  points: z.array(point).min(2).max(MAX_VERTICES),
  label: z.string().max(200).optional(),
})

export const yardBackdrop = z.object({
  uploadId: z.string().min(1).max(80),
  x: coord.default(0),
  y: coord.default(0),
  // metres per image pixel
  scale: z.number().positive().max(100),
  opacity: z.number().min(0).max(1).default(0.5),
  locked: z.boolean().default(false),
})

export const yardDocument = z.object({
  format: z.literal(YARD_FORMAT).default(YARD_FORMAT),
  name: z.string().trim().max(120).optional(),
  region: regionCode.optional(),
  zone: hardinessZone.nullable().optional(),
  frost: z.object({ lastSpring: monthDay.nullable().optional(), firstFall: monthDay.nullable().optional() }).optional(),
  units: z.enum(['ft', 'm']).default('ft'),
  boundary: z.array(point).max(MAX_VERTICES).refine((pts) => pts.length === 0 || pts.length >= 3, 'A lot outline needs at least 3 points')
    .refine((pts) => pts.length === 0 || firstSelfIntersection(pts as Point[]) < 0, 'The lot outline crosses itself or has no area')
    .default([]),
  areas: z.array(named(yardArea, 'Area')).max(MAX_AREAS, `A yard has at most ${MAX_AREAS} areas`).default([]),
  plantings: z.array(named(yardPlanting, 'Planting')).max(MAX_PLANTINGS, `A yard has at most ${MAX_PLANTINGS} plantings`).default([]),
  lines: z.array(named(yardLine, 'Line')).max(500).default([]),
  backdrop: yardBackdrop.nullable().optional(),
}).superRefine((doc, ctx) => {
  const seen = new Set<string>()
  for (const [list, items] of [['areas', doc.areas], ['plantings', doc.plantings], ['lines', doc.lines]] as const) {
    items.forEach((item, i) => {
      if (seen.has(item.id)) ctx.addIssue({ code: 'custom', path: [list, i, 'id'], message: `Duplicate element id "${item.id}"`, input: item.id })
      seen.add(item.id)
    })
  }
})

export type YardDocument = z.infer<typeof yardDocument>
export type YardDocumentInput = z.input<typeof yardDocument>
export type YardArea = z.infer<typeof yardArea>
export type YardPlanting = z.infer<typeof yardPlanting>
export type YardLine = z.infer<typeof yardLine>

export function isAreaPlanting(p: YardPlanting): p is YardPlanting & { points: Point[] } {
  return Array.isArray(p.points)
}

export function emptyYardDocument(partial: Partial<YardDocument> = {}): YardDocument {
  return { format: YARD_FORMAT, units: 'ft', boundary: [], areas: [], plantings: [], lines: [], ...partial }
}
