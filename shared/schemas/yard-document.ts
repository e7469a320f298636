import { z } from 'zod'
import { firstSelfIntersection, type Point } from '../utils/polygon'
import { regionCode, hardinessZone, monthDay } from './common'
import { frostOrderOk } from '../utils/seed-season'

// The yard document: our own JSON format (format tag "wildward.yard/1"), stored per yard and used for export
// and import. All lengths in metres, x to the right and y down, origin at the lot's top-left.

export const YARD_FORMAT = 'wildward.yard/1'
export const MAX_PLANTINGS = 5000
export const MAX_AREAS = 2000
const MAX_VERTICES = 1000
/**
 * Vertices in a whole document (lot, areas, planting outlines, lines): bounds the work of checking and scoring
 * one request. A hand-drawn yard has a few thousand.
 */
export const MAX_DOCUMENT_VERTICES = 20_000
/** The largest yard document a request may carry, in bytes of JSON (well under MariaDB's max_allowed_packet). */
export const MAX_DOCUMENT_BYTES = 4 * 1024 * 1024
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

/** A yard's frost dates: each a real day, and the last spring frost before the first fall frost. */
export const frostDatesSchema = z.object({ lastSpring: monthDay.nullable().optional(), firstFall: monthDay.nullable().optional() })
  .refine((f) => !f.lastSpring || !f.firstFall || frostOrderOk(f.lastSpring, f.firstFall),
    { path: ['firstFall'], message: 'The first fall frost comes after the last spring frost: check both dates' })

const yardDocumentBase = z.object({
  format: z.literal(YARD_FORMAT).default(YARD_FORMAT),
  name: z.string().trim().max(120).optional(),
  region: regionCode.optional(),
  zone: hardinessZone.nullable().optional(),
  frost: frostDatesSchema.optional(),
  units: z.enum(['ft', 'm']).default('ft'),
  boundary: z.array(point).max(MAX_VERTICES).refine((pts) => pts.length === 0 || pts.length >= 3, 'A lot outline needs at least 3 points')
    .refine((pts) => pts.length === 0 || firstSelfIntersection(pts as Point[]) < 0, 'The lot outline crosses itself or has no area')
    .default([]),
  areas: z.array(yardArea).max(MAX_AREAS, `A yard has at most ${MAX_AREAS} areas`).default([]),
  plantings: z.array(yardPlanting).max(MAX_PLANTINGS, `A yard has at most ${MAX_PLANTINGS} plantings`).default([]),
  lines: z.array(yardLine).max(500).default([]),
  backdrop: yardBackdrop.nullable().optional(),
})

export type ElementIssue = { path: PropertyKey[]; message: string }

/** What is wrong with one well-formed area or planting on its own: an outline that crosses itself, no position. */
export function elementIssue(list: 'areas' | 'plantings', item: YardArea | YardPlanting): ElementIssue | null {
  if (list === 'plantings') {
    const issue = plantingShapeIssue(item as YardPlanting)
    if (issue) return { path: issue.path, message: issue.message }
  }
  const pts = item.points as Point[] | undefined
  const edge = pts ? firstSelfIntersection(pts) : -1
  return edge >= 0 ? { path: ['points'], message: `The outline crosses itself (edge ${edge + 1}) or has no area` } : null
}

/** Element ids must be unique across areas, plantings and lines. */
export function duplicateIdIssues(doc: Pick<YardDocument, 'areas' | 'plantings' | 'lines'>): ElementIssue[] {
  const issues: ElementIssue[] = []
  const seen = new Set<string>()
  for (const [list, items] of [['areas', doc.areas], ['plantings', doc.plantings], ['lines', doc.lines]] as const) {
    items.forEach((item, i) => {
      if (seen.has(item.id)) issues.push({ path: [list, i, 'id'], message: `Duplicate element id "${item.id}"` })
      seen.add(item.id)
    })
  }
  return issues
}

/** Checks across elements, on a document whose fields are each well formed: ids, outlines, point or area. */
/** The vertices a document holds, summed over every outline and line. */
export function documentVertices(doc: unknown): number {
  if (!isPlain(doc)) return 0
  let total = Array.isArray(doc.boundary) ? doc.boundary.length : 0
  for (const list of [doc.areas, doc.plantings, doc.lines]) {
    if (!Array.isArray(list)) continue
    for (const item of list) if (isPlain(item) && Array.isArray(item.points)) total += item.points.length
  }
  return total
}

const tooManyVertices = (vertices: number) => `A yard has at most ${MAX_DOCUMENT_VERTICES.toLocaleString('en-US')} outline points in all (this one has ${vertices.toLocaleString('en-US')})`

function documentIssues(doc: z.output<typeof yardDocumentBase>): ElementIssue[] {
  const vertices = documentVertices(doc)
  // checked before any outline is: the crossing checks below are what the bound keeps small
  if (vertices > MAX_DOCUMENT_VERTICES) return [{ path: [], message: tooManyVertices(vertices) }]
  const issues = duplicateIdIssues(doc)
  for (const [list, items] of [['areas', doc.areas], ['plantings', doc.plantings]] as const) {
    items.forEach((item, i) => {
      const issue = elementIssue(list, item)
      if (issue) issues.push({ path: [list, i, ...issue.path], message: issue.message })
    })
  }
  return issues
}

/** The whole document in plain zod: the reference the fast path below must agree with (and the error messages). */
export const yardDocumentShape = yardDocumentBase.superRefine((doc, ctx) => {
  for (const issue of documentIssues(doc)) ctx.addIssue({ code: 'custom', path: issue.path, message: issue.message, input: doc })
})

const yardDocumentRest = yardDocumentBase.omit({ areas: true, plantings: true })
const NOUNS: Record<string, string> = { areas: 'Area', plantings: 'Planting', lines: 'Line' }

// Fast path for the two long lists: a plain loop accepting exactly what the zod element schemas accept and
// building the same output (unknown keys dropped, names trimmed, area z defaulting to 0), or null to let zod
// parse (and explain). Every save and POST /api/score sends the whole document; zod's checks cost ~3 µs a planting.
const isNum = (v: unknown, min: number, max: number): v is number => typeof v === 'number' && Number.isFinite(v) && v >= min && v <= max
const isInt = (v: unknown, min: number, max: number) => isNum(v, min, max) && Number.isSafeInteger(v)
const isPos = (v: unknown, max: number) => typeof v === 'number' && Number.isFinite(v) && v > 0 && v <= max
const isStr = (v: unknown, max: number): v is string => typeof v === 'string' && v.length <= max
const isPlain = (v: unknown): v is Record<string, unknown> => typeof v === 'object' && v !== null && !Array.isArray(v)

function fastRing(v: unknown, min: number): Point[] | null {
  if (!Array.isArray(v) || v.length < min || v.length > MAX_VERTICES) return null
  const out: Point[] = new Array(v.length)
  for (let i = 0; i < v.length; i++) {
    const p = v[i]
    if (!Array.isArray(p) || p.length !== 2 || !isNum(p[0], -MAX_COORD, MAX_COORD) || !isNum(p[1], -MAX_COORD, MAX_COORD)) return null
    out[i] = [p[0], p[1]]
  }
  return out
}

function fastPlanting(v: unknown): YardPlanting | null {
  if (!isPlain(v)) return null
  const { id, species, cultivar, label, x, y, count, spread, z: zz, points, spacing, height } = v
  if (typeof id !== 'string' || id.length < 1 || id.length > 64) return null
  const out: YardPlanting = { id, species: null }
  if (species === null) out.species = null
  else if (typeof species === 'string' && species.trim().length >= 1 && species.trim().length <= 200) out.species = species.trim()
  else return null
  if (cultivar !== undefined) { if (cultivar === null) out.cultivar = null; else if (typeof cultivar === 'string' && cultivar.trim().length <= 120) out.cultivar = cultivar.trim(); else return null }
  if (label !== undefined) { if (isStr(label, 200)) out.label = label; else return null }
  if (x !== undefined) { if (isNum(x, -MAX_COORD, MAX_COORD)) out.x = x; else return null }
  if (y !== undefined) { if (isNum(y, -MAX_COORD, MAX_COORD)) out.y = y; else return null }
  if (count !== undefined) { if (isInt(count, 1, 100_000)) out.count = count as number; else return null }
  if (spread !== undefined) { if (isPos(spread, 60)) out.spread = spread as number; else return null }
  if (zz !== undefined) { if (isInt(zz, -1_000_000, 1_000_000)) out.z = zz as number; else return null }
  if (points !== undefined) { const ring = fastRing(points, 3); if (ring) out.points = ring; else return null }
  if (spacing !== undefined) { if (spacing === null || isPos(spacing, 20)) out.spacing = spacing as number | null; else return null }
  if (height !== undefined) { if (isPos(height, 120)) out.height = height as number; else return null }
  return out
}

const AREA_KIND_SET = new Set<unknown>(AREA_KINDS)
const SUN_SET = new Set<unknown>(SUN)
const SOIL_SET = new Set<unknown>(SOIL)
const MOISTURE_SET = new Set<unknown>(MOISTURE)

function fastArea(v: unknown): YardArea | null {
  if (!isPlain(v)) return null
  const { id, kind, z: zz, points, sun, soil, moisture, label } = v
  if (typeof id !== 'string' || id.length < 1 || id.length > 64 || !AREA_KIND_SET.has(kind)) return null
  if (zz !== undefined && !isInt(zz, -1_000_000, 1_000_000)) return null
  const ring = fastRing(points, 3)
  if (!ring) return null
  const out: YardArea = { id, kind: kind as YardArea['kind'], z: (zz as number | undefined) ?? 0, points: ring }
  if (sun !== undefined) { if (SUN_SET.has(sun)) out.sun = sun as YardArea['sun']; else return null }
  if (soil !== undefined) { if (SOIL_SET.has(soil)) out.soil = soil as YardArea['soil']; else return null }
  if (moisture !== undefined) { if (MOISTURE_SET.has(moisture)) out.moisture = moisture as YardArea['moisture']; else return null }
  if (label !== undefined) { if (isStr(label, 200)) out.label = label; else return null }
  return out
}

function fastList<T>(v: unknown, max: number, one: (x: unknown) => T | null): T[] | null {
  if (v === undefined) return []
  if (!Array.isArray(v) || v.length > max) return null
  const out: T[] = new Array(v.length)
  for (let i = 0; i < v.length; i++) {
    const item = one(v[i])
    if (!item) return null
    out[i] = item
  }
  return out
}

function fastDocument(value: unknown): z.output<typeof yardDocumentBase> | null {
  if (!isPlain(value)) return null
  const plantings = fastList(value.plantings, MAX_PLANTINGS, fastPlanting)
  const areas = plantings && fastList(value.areas, MAX_AREAS, fastArea)
  if (!plantings || !areas) return null
  const { plantings: _p, areas: _a, ...rest } = value
  const parsed = yardDocumentRest.safeParse(rest)
  if (!parsed.success) return null
  const doc = { ...parsed.data, areas, plantings }
  return documentIssues(doc).length ? null : doc
}

/**
 * The yard document schema. Errors inside a list keep their path (`plantings.3.points`) and name the element
 * (`Planting "p4": …`), so a 400 for a yard of a thousand plantings says which one is wrong.
 */
export const yardDocument = z.custom<z.input<typeof yardDocumentShape>>(() => true).transform((value, ctx): z.output<typeof yardDocumentShape> => {
  // counted on the raw value first, so an oversized document never reaches zod's per-point checks
  const vertices = documentVertices(value)
  if (vertices > MAX_DOCUMENT_VERTICES) {
    ctx.addIssue({ code: 'custom', path: [], input: value, message: tooManyVertices(vertices) })
    return z.NEVER
  }
  const fast = fastDocument(value)
  if (fast) return fast
  const result = yardDocumentShape.safeParse(value)
  if (result.success) return result.data
  for (const issue of result.error.issues) {
    const [list, index] = issue.path
    const element = typeof list === 'string' && typeof index === 'number' ? (value as Record<string, unknown[]>)[list]?.[index] : undefined
    const id = element && typeof (element as { id?: unknown }).id === 'string' ? (element as { id: string }).id : null
    const noun = typeof list === 'string' && typeof index === 'number' ? NOUNS[list] : undefined
    ctx.addIssue({ code: 'custom', path: issue.path as PropertyKey[], input: element ?? value, message: noun ? `${noun}${id ? ` "${id}"` : ` ${Number(index) + 1}`}: ${issue.message}` : issue.message })
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
