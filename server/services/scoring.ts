// The native-share engine: footprints, layers, ground-layer cutting, the three shares and the moves to the goal.
// `scoreYard` is pure (the facts and goal are passed in); `scoreDocument` loads them for a saved or posted yard.
import { isAreaPlanting, type YardDocument, type YardPlanting } from '#shared/schemas/yard-document'
import type { Layer, PlantingStatus, SpeciesFacts } from '#shared/types/species'
import type { Score, ScoredPlanting, ScoreWarning, Shares, ShareKind, Totals } from '#shared/schemas/score'
import { circleAreaInLot, cutterOf, visibleArea, ringInLot, type Cutter, type Shape } from '#shared/utils/geometry'
import type { Ring } from '#shared/utils/polygon'
import { pointInRing } from '#shared/utils/polygon'
import { plantsNeeded } from '#shared/utils/plant-count'
import { regionName } from '#shared/utils/regions'
import { movesToGoal } from './moves'

/**
 * Sizes assumed when neither the planting nor the catalogue gives one, and for plants a move adds
 * (from memory, common practice for nursery stock at maturity): spread and height in metres, drift spacing.
 */
export const TYPICAL_SIZE: Record<Layer, { spread: number; height: number; spacing: number | null }> = {
  tree: { spread: 8, height: 12, spacing: null },
  shrub: { spread: 1.5, height: 1.5, spacing: null },
  ground: { spread: 0.45, height: 0.6, spacing: 0.45 },
}

/** Everything the engine works out for one planting (areas in m², volumes in m³, before rounding). */
export interface PlantingMeasure {
  index: number
  id: string
  name: string
  /** the name lower-cased: plantings of one species are grouped by it */
  nameKey: string
  status: PlantingStatus
  layer: Layer
  isArea: boolean
  lawn: boolean
  cultivar: boolean
  count: number | null
  area: number
  volume: number
  spread: number | null
  height: number
  spacing: number | null
}

export interface MeasuredYard {
  doc: YardDocument
  region: string | null
  lot: Shape | null
  plantings: PlantingMeasure[]
  warnings: ScoreWarning[]
  /** with a memo: each planting's remembered result, by index */
  remembered?: Array<Remembered | undefined>
}

export const factsKey = (species: string) => species.trim().toLowerCase()

// unidentified plants: a layer from their size (tree ≥ 6 m tall, shrub ≥ 1 m; common practice)
export function layerBySize(p: YardPlanting): Layer {
  if (isAreaPlanting(p)) return 'ground'
  const size = p.height ?? p.spread
  if (size === undefined) return 'shrub'
  return size >= 6 ? 'tree' : size >= 1 ? 'shrub' : 'ground'
}

type Drawn = { order: [number, number, number]; ring: Ring; plantingIndex: number | null }

/**
 * For each ground-layer area planting, the shapes drawn above it: anything with a higher z, and at equal z
 * the later one (areas sit under plantings of the same z, so a drift drawn in its bed stays visible).
 */
// prepared shapes per outline array: a re-score after an edit shares the unchanged outlines (never mutated
// once validated) with the document before it, so their shapes are not worked out again
const preparedShapes = new WeakMap<Ring, Shape>()
function preparedShape(ring: Ring): Shape {
  let shape = preparedShapes.get(ring)
  if (!shape) preparedShapes.set(ring, (shape = cutterOf(ring)))
  return shape
}

export function groundCutters(doc: YardDocument, isGroundArea: (index: number) => boolean, shapes = new Map<number, Shape>()): Map<number, Cutter[]> {
  const drawn: Drawn[] = []
  doc.areas.forEach((a, i) => drawn.push({ order: [a.z ?? 0, 0, i], ring: a.points as Ring, plantingIndex: null }))
  doc.plantings.forEach((p, i) => {
    if (isAreaPlanting(p) && isGroundArea(i)) drawn.push({ order: [p.z ?? 0, 1, i], ring: p.points as Ring, plantingIndex: i })
  })
  drawn.sort((a, b) => a.order[0] - b.order[0] || a.order[1] - b.order[1] || a.order[2] - b.order[2])
  const out = new Map<number, Cutter[]>()
  const cutters = drawn.map((d) => preparedShape(d.ring))
  drawn.forEach((d, k) => { if (d.plantingIndex !== null) { out.set(d.plantingIndex, cutters.slice(k + 1)); shapes.set(d.plantingIndex, cutters[k]!) } })
  return out
}

export function lotShape(doc: YardDocument): Shape | null {
  return doc.boundary.length >= 3 ? preparedShape(doc.boundary as Ring) : null
}

/** What the engine worked out for one planting object, with everything the answer depended on. */
export interface Remembered {
  key: string | null
  facts: SpeciesFacts | undefined
  lot: Shape | null
  region: string | null
  above: Cutter[] | undefined
  measure: PlantingMeasure
  warnings: ScoreWarning[]
  line?: ScoredPlanting
}

/**
 * Per-planting results kept between scores of one yard as it is edited, keyed by the planting object (a
 * re-score after an edit shares unchanged plantings with the document before it). A result is reused only when
 * the planting, its species facts, the lot, the region and — for the ground layer — every shape drawn above it
 * are the same, so the answer is exactly what a fresh computation gives.
 */
export interface MeasureMemo {
  plantings: WeakMap<YardPlanting, Remembered>
  /** one object per species while its facts stay equal, so a planting's facts are compared by identity */
  facts: Map<string, SpeciesFacts>
}

export const newMeasureMemo = (): MeasureMemo => ({ plantings: new WeakMap(), facts: new Map() })

export function sameFacts(a: SpeciesFacts | undefined, b: SpeciesFacts | undefined): boolean {
  if (a === b) return true
  if (!a || !b) return false
  return a.status === b.status && a.layer === b.layer && a.spread === b.spread && a.height === b.height && a.spacing === b.spacing
    && a.lawn === b.lawn && a.scientificName === b.scientificName && a.commonName === b.commonName && a.estimated.join() === b.estimated.join()
}

/** `facts` with each entry replaced by the memo's equal object, when it has one. */
export function canonicalFacts(facts: Map<string, SpeciesFacts>, memo: MeasureMemo): Map<string, SpeciesFacts> {
  const out = new Map<string, SpeciesFacts>()
  for (const [key, f] of facts) {
    const known = memo.facts.get(key)
    if (known && sameFacts(known, f)) out.set(key, known)
    else { memo.facts.set(key, f); out.set(key, f) }
  }
  return out
}

function sameCutters(a: Cutter[] | undefined, b: Cutter[] | undefined): boolean {
  if (a === b) return true
  if (!a || !b || a.length !== b.length) return false
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false
  return true
}

/** Status, layer and footprint of every planting. */
export function measureYard(doc: YardDocument, facts: Map<string, SpeciesFacts>, regionArg?: string | null, memo?: MeasureMemo): MeasuredYard {
  const region = regionArg ?? doc.region ?? null
  const warnings: ScoreWarning[] = []
  if (!region) warnings.push({ id: 'region', message: 'The yard has no state or province, so no plant can be counted as native yet' })
  const lot = lotShape(doc)
  const where = region ? regionName(region) : 'this region'

  if (memo) facts = canonicalFacts(facts, memo)
  const n = doc.plantings.length
  const known: Array<Remembered | undefined> = new Array(n)
  const keys: Array<string | null> = new Array(n)
  const factsOf: Array<SpeciesFacts | undefined> = new Array(n)
  const layers: Layer[] = new Array(n)
  for (let i = 0; i < n; i++) {
    const p = doc.plantings[i]!
    const k = memo?.plantings.get(p)
    known[i] = k
    // a remembered planting is the same object, so its species (and lower-cased key) is the same
    const key = k ? k.key : p.species ? factsKey(p.species) : null
    keys[i] = key
    const f = key ? facts.get(key) : undefined
    factsOf[i] = f
    layers[i] = f?.layer ?? layerBySize(p)
  }
  const shapes = new Map<number, Shape>()
  const cutters = groundCutters(doc, (i) => layers[i] === 'ground', shapes)

  const plantings = doc.plantings.map((p, index): PlantingMeasure => {
    const f = factsOf[index]
    const above = cutters.get(index)
    const k = known[index]
    if (k && k.facts === f && k.lot === lot && k.region === region && sameCutters(k.above, above)) {
      for (const w of k.warnings) warnings.push(w)
      if (k.measure.index !== index) k.measure = { ...k.measure, index }
      return k.measure
    }
    const mark = warnings.length
    const measure = measurePlanting(p, index, f, layers[index]!, { lot, region, where, above, own: shapes.get(index) }, warnings)
    if (memo) memo.plantings.set(p, (known[index] = { key: keys[index]!, facts: f, lot, region, above, measure, warnings: warnings.slice(mark) }))
    return measure
  })
  return { doc, region, lot, plantings, warnings, remembered: memo ? known : undefined }
}

/** Where a planting is measured: the lot, the region (and its name for warnings), and for the ground layer the shapes above it and its own. */
export interface PlantingContext { lot: Shape | null; region: string | null; where: string; above?: Cutter[]; own?: Shape }

/** Status, layer and footprint of one planting; its warnings go to `warnings`. */
export function measurePlanting(p: YardPlanting, index: number, f: SpeciesFacts | undefined, layer: Layer, ctx: PlantingContext, warnings: ScoreWarning[]): PlantingMeasure {
  const { lot, region, where } = ctx
  let status: PlantingStatus = 'unknown'
  if (p.species && !region) status = 'unknown'
  else if (p.species && !f) warnings.push({ id: p.id, message: `"${p.species}" is not in the species catalogue, so it counts as unknown (not native)` })
  else if (f && f.status === 'absent') {
    status = 'introduced'
    warnings.push({ id: p.id, message: `${f.scientificName} is not recorded in ${where}, so it counts as introduced` })
  } else if (f) status = f.status as PlantingStatus
  const name = f?.commonName ?? f?.scientificName ?? p.species ?? p.label ?? 'unidentified plant'
  const nameKey = name.toLowerCase()
  const cultivar = typeof p.cultivar === 'string' && p.cultivar.length > 0
  const typical = TYPICAL_SIZE[layer]
  const height = p.height ?? f?.height ?? typical.height
  if (p.height === undefined && (!f || f.estimated.includes('height'))) warnings.push({ id: p.id, message: `The height of ${name} is an estimate (${height} m); measure or check it` })

  if (isAreaPlanting(p)) {
    const spacing = p.spacing !== undefined ? p.spacing : f ? f.spacing : null
    const ring = p.points as Ring
    const area = layer === 'ground' ? visibleArea(ring, lot, ctx.above ?? [], ctx.own).area : ringInLot(ring, lot).area
    if (area === 0) warnings.push({ id: p.id, message: layer === 'ground' ? `${name} is outside the lot or wholly covered by shapes drawn above it, so it counts nothing` : `${name} is outside the lot, so it counts nothing` })
    // built as one literal: spreading a shared base object here cost more than the geometry
    return { index, id: p.id, name, nameKey, status, layer, isArea: true, lawn: f?.lawn === true, cultivar, count: spacing === null ? null : plantsNeeded(area, spacing), area, volume: area * height, spread: null, height, spacing }
  }
  const spread = p.spread ?? f?.spread ?? typical.spread
  if (p.spread === undefined && (!f || f.estimated.includes('spread'))) warnings.push({ id: p.id, message: `The spread of ${name} is an estimate (${spread} m); measure or check it` })
  const count = p.count ?? 1
  // a clump of n plants is one disc of n plants' footprint, centred on the planting
  const area = circleAreaInLot(p.x!, p.y!, (spread / 2) * Math.sqrt(count), lot)
  const centreIn = !lot || pointInRing([p.x!, p.y!], lot.ring)
  if (!centreIn) warnings.push({ id: p.id, message: `${name} stands outside the lot, so its plants are not counted` })
  return { index, id: p.id, name, nameKey, status, layer, isArea: false, lawn: false, cultivar, count: centreIn ? count : 0, area, volume: area * height, spread, height, spacing: null }
}

export const round3 = (x: number) => Math.round(x * 1000) / 1000

// the answer's line for a planting; kept with a remembered result so an unchanged planting keeps the same line
export function lineOf(p: PlantingMeasure, known: Remembered | undefined): ScoredPlanting {
  if (known?.measure === p && known.line) return known.line
  const line = { id: p.id, status: p.status, layer: p.layer, count: p.count, area: round3(p.area), volume: round3(p.volume), cultivar: p.cultivar }
  if (known?.measure === p) known.line = line
  return line
}
const SHARE_FIELDS: ShareKind[] = ['count', 'area', 'volume']

export function contribution(p: PlantingMeasure, share: ShareKind): number {
  return share === 'count' ? (p.count ?? 0) : share === 'area' ? p.area : p.volume
}

/** Sums over a measured yard, made in one pass: per status, native, straight-species native, and total. */
export interface YardTally {
  byStatus: Record<PlantingStatus, Totals>
  native: Totals
  straight: Totals
  total: Totals
  /** the plantings the moves look at: invasive ones, and lawn */
  invasive: PlantingMeasure[]
  lawn: PlantingMeasure[]
}

// Sums are made in blocks of plantings, then over the blocks: a re-score after an edit redoes only the blocks it
// touched and gets exactly the sums a fresh score makes (the same additions in the same order).
export const TALLY_BLOCK = 32
const SUMS = 18
const SLOT: Record<PlantingStatus, number> = { native: 0, introduced: 3, invasive: 6, nativeAndIntroduced: 9, unknown: 12 }
const STATUSES = Object.keys(SLOT) as PlantingStatus[]

/** Per status (count, area, volume) and, last, straight-species natives, over plantings of one block. */
export function tallyBlock(plantings: PlantingMeasure[], block: number): Float64Array {
  const out = new Float64Array(SUMS)
  const end = Math.min(plantings.length, (block + 1) * TALLY_BLOCK)
  for (let i = block * TALLY_BLOCK; i < end; i++) {
    const p = plantings[i]!
    const o = SLOT[p.status]
    const count = p.count ?? 0
    out[o] = out[o]! + count; out[o + 1] = out[o + 1]! + p.area; out[o + 2] = out[o + 2]! + p.volume
    if (p.status === 'native' && !p.cultivar) { out[15] = out[15]! + count; out[16] = out[16]! + p.area; out[17] = out[17]! + p.volume }
  }
  return out
}

export function tallyBlocks(plantings: PlantingMeasure[]): Float64Array[] {
  return Array.from({ length: Math.ceil(plantings.length / TALLY_BLOCK) }, (_, b) => tallyBlock(plantings, b))
}

/** The tally from block sums and the plantings the moves need (invasive ones and lawn, in planting order). */
export function tallyFrom(blocks: Float64Array[], invasive: PlantingMeasure[], lawn: PlantingMeasure[]): YardTally {
  const sum = new Float64Array(SUMS)
  for (const b of blocks) for (let k = 0; k < SUMS; k++) sum[k] = sum[k]! + b[k]!
  const totals = (o: number): Totals => ({ count: sum[o]!, area: sum[o + 1]!, volume: sum[o + 2]! })
  const byStatus = {} as Record<PlantingStatus, Totals>
  const total: Totals = { count: 0, area: 0, volume: 0 }
  for (const status of STATUSES) {
    const t = (byStatus[status] = totals(SLOT[status]))
    total.count += t.count; total.area += t.area; total.volume += t.volume
  }
  return { byStatus, native: byStatus.native, straight: totals(15), total, invasive, lawn }
}

export function tallyYard(plantings: PlantingMeasure[]): YardTally {
  return tallyFrom(tallyBlocks(plantings), plantings.filter((p) => p.status === 'invasive'), plantings.filter((p) => p.lawn && p.isArea))
}

function sharesOf(native: Totals, total: Totals): Shares {
  const out = {} as Shares
  for (const s of SHARE_FIELDS) out[s] = { native: round3(native[s]), total: round3(total[s]), share: total[s] > 0 ? native[s] / total[s] : null }
  return out
}

/** What a score is made from: the measured plantings with their answer lines, the tally and the warnings. */
export interface ScoreParts {
  doc: YardDocument
  region: string | null
  lot: Shape | null
  measures: PlantingMeasure[]
  lines: ScoredPlanting[]
  /** the region warning (if any), then each planting's, in planting order */
  warnings: ScoreWarning[]
  blocks: Float64Array[]
  invasive: PlantingMeasure[]
  lawn: PlantingMeasure[]
}

export function assembleScore(parts: ScoreParts, goal: number): Score {
  const tally = tallyFrom(parts.blocks, parts.invasive, parts.lawn)
  const byStatus = {} as Score['byStatus']
  for (const [status, t] of Object.entries(tally.byStatus)) byStatus[status as PlantingStatus] = { count: t.count, area: round3(t.area), volume: round3(t.volume) }
  const measured: MeasuredYard = { doc: parts.doc, region: parts.region, lot: parts.lot, plantings: parts.measures, warnings: parts.warnings }
  const { moves, warnings: moveWarnings } = movesToGoal(measured, goal, tally)
  return {
    goal,
    shares: sharesOf(tally.native, tally.total),
    byStatus,
    straightSpecies: sharesOf(tally.straight, tally.total),
    plantings: parts.lines,
    moves,
    warnings: moveWarnings.length ? [...parts.warnings, ...moveWarnings] : parts.warnings,
  }
}

/** Everything a fresh score is made from (the memo, when given, is used and filled). */
export function scoreParts(doc: YardDocument, facts: Map<string, SpeciesFacts>, region?: string | null, memo?: MeasureMemo): ScoreParts & { remembered?: Array<Remembered | undefined> } {
  const measured = measureYard(doc, facts, region, memo)
  const remembered = measured.remembered
  const measures = measured.plantings
  return {
    doc, region: measured.region, lot: measured.lot, measures, warnings: measured.warnings, remembered,
    lines: measures.map((p, i) => lineOf(p, remembered?.[i])),
    blocks: tallyBlocks(measures),
    invasive: measures.filter((p) => p.status === 'invasive'),
    lawn: measures.filter((p) => p.lawn && p.isArea),
  }
}

/** The score of a yard document for a region, from species facts keyed by lower-case name, against `goal`. */
export function scoreYard(doc: YardDocument, facts: Map<string, SpeciesFacts>, goal: number, region?: string | null, memo?: MeasureMemo): Score {
  return assembleScore(scoreParts(doc, facts, region, memo), goal)
}

// loaded on first use so the pure engine can be imported without the database layer (once: a dynamic import
// resolves the module again on every call)
let databaseLayer: Promise<[typeof import('./species-lookup'), typeof import('./organisation')]> | null = null

/** The lower-cased species names of a document's plantings (distinct names first: a few dozen over a thousand plantings). */
export function speciesKeys(doc: YardDocument): Set<string> {
  const given = new Set<string>()
  for (const p of doc.plantings) if (p.species) given.add(p.species)
  const names = new Set<string>()
  for (const n of given) names.add(factsKey(n))
  return names
}

/** Catalogue facts for `names` in `region`, and the organisation's goal. */
export async function factsAndGoal(names: Set<string>, region: string | null): Promise<{ facts: Map<string, SpeciesFacts>; goal: number }> {
  const [{ loadSpeciesFacts }, { organisationGoal }] = await (databaseLayer ??= Promise.all([import('./species-lookup'), import('./organisation')]))
  const [facts, goal] = await Promise.all([
    region && names.size ? loadSpeciesFacts(names, region) : Promise.resolve(new Map<string, SpeciesFacts>()),
    organisationGoal(),
  ])
  return { facts, goal }
}

/** The score of a document, with facts from the species catalogue and the organisation's goal. */
export async function scoreDocument(doc: YardDocument, region?: string | null): Promise<Score> {
  const where = region ?? doc.region ?? null
  const { facts, goal } = await factsAndGoal(speciesKeys(doc), where)
  return scoreYard(doc, facts, goal, where)
}
