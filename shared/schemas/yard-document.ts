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

// outlines are checked for crossings once, in the document pass below (cheaper than a refinement per ring)
const ring = z.array(point).min(3, 'A shape needs at least 3 points').max(MAX_VERTICES)

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
})

/** Why a planting is neither a point (x, y) nor an area (points), or null when it is one of them. */
export function plantingShapeIssue(p: { x?: number; y?: number; points?: unknown }): { path: string[]; message: string } | null {
  const isPoint = p.x !== undefined || p.y !== undefined
  if (isPoint && p.points) return { path: [], message: 'A planting is either a point (x, y) or an area (points), not both' }
  if (isPoint && (p.x === undefined || p.y === undefined)) return { path: [p.x === undefined ? 'x' : 'y'], message: 'A point planting needs both x and y' }
  if (!isPoint && !p.points) return { path: [], message: 'A planting needs a position (x, y) or an outline (points)' }
  return null
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

export const yardDocumentShape = z.object({
  format: z.literal(YARD_FORMAT).default(YARD_FORMAT),
  name: z.string().trim().max(120).optional(),
  region: regionCode.optional(),
  zone: hardinessZone.nullable().optional(),
  frost: z.object({ lastSpring: monthDay.nullable().optional(), firstFall: monthDay.nullable().optional() }).optional(),
  units: z.enum(['ft', 'm']).default('ft'),
  boundary: z.array(point).max(MAX_VERTICES).refine((pts) => pts.length === 0 || pts.length >= 3, 'A lot outline needs at least 3 points')
    .refine((pts) => pts.length === 0 || firstSelfIntersection(pts as Point[]) < 0, 'The lot outline crosses itself or has no area')
    .default([]),
  areas: z.array(yardArea).max(MAX_AREAS, `A yard has at most ${MAX_AREAS} areas`).default([]),
  plantings: z.array(yardPlanting).max(MAX_PLANTINGS, `A yard has at most ${MAX_PLANTINGS} plantings`).default([]),
  lines: z.array(yardLine).max(500).default([]),
  backdrop: yardBackdrop.nullable().optional(),
}).superRefine((doc, ctx) => {
  const seen = new Set<string>()
  for (const [list, items] of [['areas', doc.areas], ['plantings', doc.plantings], ['lines', doc.lines]] as const) {
    items.forEach((item, i) => {
      if (seen.has(item.id)) ctx.addIssue({ code: 'custom', path: [list, i, 'id'], message: `Duplicate element id "${item.id}"`, input: item.id })
      seen.add(item.id)
    })
  }
  const crossing = (list: string, i: number, pts: Point[]) => {
    const edge = firstSelfIntersection(pts)
    if (edge >= 0) ctx.addIssue({ code: 'custom', path: [list, i, 'points'], message: `The outline crosses itself (edge ${edge + 1}) or has no area`, input: pts })
  }
  doc.areas.forEach((a, i) => crossing('areas', i, a.points as Point[]))
  doc.plantings.forEach((p, i) => {
    const issue = plantingShapeIssue(p)
    if (issue) ctx.addIssue({ code: 'custom', path: ['plantings', i, ...issue.path], message: issue.message, input: p })
    else if (p.points) crossing('plantings', i, p.points as Point[])
  })
})

const NOUNS: Record<string, string> = { areas: 'Area', plantings: 'Planting', lines: 'Line' }

/**
 * The yard document schema. Errors inside a list keep their path (`plantings.3.points`) and name the element
 * (`Planting "p4": …`), so a 400 for a yard of a thousand plantings says which one is wrong. The element
 * checks run once over the parsed document, which keeps validating big documents cheap.
 */
export const yardDocument = z.custom<z.input<typeof yardDocumentShape>>(() => true).transform((value, ctx): z.output<typeof yardDocumentShape> => {
  const result = yardDocumentShape.safeParse(value)
  if (result.success) return result.data
  for (const issue of result.error.issues) {
    const [list, index] = issue.path
    const element = typeof list === 'string' && typeof index === 'number' ? (value as Record<string, unknown[]>)[list]?.[index] : undefined
    const id = element && typeof (element as { id?: unknown }).id === 'string' ? (element as { id: string }).id : null
    const noun = typeof list === 'string' && typeof index === 'number' ? NOUNS[list] : undefined
    ctx.addIssue({ code: 'custom', path: issue.path as PropertyKey[], input: element ?? value, message: noun ? `${noun}${id ? ` "${id}"` : ` ${index + 1}`}: ${issue.message}` : issue.message })
  }
  return z.NEVER
})

export type YardDocument = z.infer<typeof yardDocument>
export type YardDocumentInput = z.input<typeof yardDocumentShape>
export type YardArea = z.infer<typeof yardArea>
export type YardPlanting = z.infer<typeof yardPlanting>
export type YardLine = z.infer<typeof yardLine>

export function isAreaPlanting(p: YardPlanting): p is YardPlanting & { points: Point[] } {
  return Array.isArray(p.points)
}

export function emptyYardDocument(partial: Partial<YardDocument> = {}): YardDocument {
  return { format: YARD_FORMAT, units: 'ft', boundary: [], areas: [], plantings: [], lines: [], ...partial }
}
