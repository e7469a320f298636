// Measuring a yard: each planting's status, layer and footprint (clipped to the lot; the ground layer cut by
// whatever is drawn above it). Pure: the species facts come in as a map keyed by `nameKey`.
import { isAreaPlanting, phaseOf, type YardDocument, type YardPlanting } from '../../schemas/yard-document'
import type { Layer, PlantingStatus, SpeciesFacts } from '../../types/species'
import type { ScoreWarning } from '../../schemas/score'
import { areaInLot, circleAreaInLot, circleRing, pointInShape, shapeOf, visibleArea, type Cutter, type Shape } from '../geometry'
import type { Ring } from '../polygon'
import { nameKey } from '../species-name'
import { plantsNeeded } from '../plant-count'
import { regionName } from '../regions'
import { sameFacts, type ScoreMemo, type Remembered } from './memo'
import { grownSize } from './growth'

/**
 * Sizes assumed when neither the planting nor the catalogue gives one, and for plants a move adds
 * (from memory, common practice for nursery stock at maturity): spread and height in metres, drift spacing.
 */
export const TYPICAL_SIZE: Record<Layer, { spread: number; height: number; spacing: number | null }> = {
  tree: { spread: 8, height: 12, spacing: null },
  shrub: { spread: 1.5, height: 1.5, spacing: null },
  ground: { spread: 0.45, height: 0.6, spacing: 0.45 },
}

/**
 * The height of a lawn drawn without one: mown, 8 cm (common practice: cool-season lawns are mown to about
 * 5–10 cm), not the grass's unmown mature height from USDA PLANTS. Marked as a default in the warnings.
 */
export const MOWN_LAWN_HEIGHT = 0.08

/** Everything the engine works out for one planting (areas in m², volumes in m³, before rounding). */
export interface PlantingMeasure {
  index: number
  id: string
  name: string
  /** the species' `nameKey` (else the shown name's): plantings of one species are grouped by it */
  group: string
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
  /** each planting's own warnings, by index (`warnings` is the yard's, then these in order) */
  own: ScoreWarning[][]
}

/** The facts keys (`nameKey`) of the species a document names. */
export function speciesKeys(doc: YardDocument): Set<string> {
  const given = new Set<string>()
  for (const p of doc.plantings) if (p.species) given.add(p.species)
  const keys = new Set<string>()
  for (const n of given) keys.add(nameKey(n))
  return keys
}

// unidentified plants: a layer from their size (tree ≥ 6 m tall, shrub ≥ 1 m; common practice)
export function layerBySize(p: YardPlanting): Layer {
  if (isAreaPlanting(p)) return 'ground'
  const size = p.height ?? p.spread
  if (size === undefined) return 'shrub'
  return size >= 6 ? 'tree' : size >= 1 ? 'shrub' : 'ground'
}

// an outline's coordinates as a string: the editor changes outlines in place, so identity alone cannot say "same"
const ringKey = (ring: Ring) => ring.join(';')

/** The prepared shape of an outline: the memo's when the outline is unchanged, else a fresh one. */
export function shapeFor(ring: Ring, memo?: ScoreMemo): Shape {
  if (!memo) return shapeOf(ring)
  const key = ringKey(ring)
  const known = memo.shapes.get(ring)
  if (known && known.key === key) return known.shape
  const shape = shapeOf(ring.map((p) => [p[0], p[1]]))
  memo.shapes.set(ring, { key, shape })
  return shape
}

type Drawn = { order: [number, number, number]; shape: () => Shape; plantingIndex: number | null }

// a clump's disc as a polygon of the same area (circleRing), so a clump wholly on the lawn cuts exactly its footprint
const DISC_SIDES = 32

/** The cutter of a ground-layer clump of radius `r` (the memo's while the planting's place and size are unchanged). */
export function discFor(p: YardPlanting, r: number, memo?: ScoreMemo): Shape {
  const make = () => shapeOf(circleRing(p.x!, p.y!, r, DISC_SIDES))
  if (!memo) return make()
  const key = `${p.x}\u0000${p.y}\u0000${r}`
  const known = memo.discs.get(p)
  if (known && known.key === key) return known.shape
  const shape = make()
  memo.discs.set(p, { key, shape })
  return shape
}

/**
 * For each ground-layer area planting, the shapes drawn above it: anything with a higher z, and at equal z
 * the later one (areas sit under plantings of the same z, so a drift drawn in its bed stays visible). A
 * ground-layer clump (a point planting, `clumpRadius` not null) sits above every outline: it cuts the lawn or
 * drift beneath it as a drift would, so its ground is not counted twice.
 */
export function groundCutters(doc: YardDocument, isGround: (index: number) => boolean, shapes = new Map<number, Shape>(), memo?: ScoreMemo, clumpRadius: (index: number) => number | null = () => null): Map<number, Cutter[]> {
  const drawn: Drawn[] = []
  doc.areas.forEach((a, i) => drawn.push({ order: [a.z ?? 0, 0, i], shape: () => shapeFor(a.points as Ring, memo), plantingIndex: null }))
  doc.plantings.forEach((p, i) => {
    if (!isGround(i)) return
    if (isAreaPlanting(p)) drawn.push({ order: [p.z ?? 0, 1, i], shape: () => shapeFor(p.points as Ring, memo), plantingIndex: i })
    else {
      const r = clumpRadius(i)
      if (r !== null && r > 0) drawn.push({ order: [Infinity, 2, i], shape: () => discFor(p, r, memo), plantingIndex: null })
    }
  })
  drawn.sort((a, b) => a.order[0] - b.order[0] || a.order[1] - b.order[1] || a.order[2] - b.order[2])
  const out = new Map<number, Cutter[]>()
  const cutters = drawn.map((d) => d.shape())
  drawn.forEach((d, k) => { if (d.plantingIndex !== null) { out.set(d.plantingIndex, cutters.slice(k + 1)); shapes.set(d.plantingIndex, cutters[k]!) } })
  return out
}

/** The radius of a ground-layer clump's footprint: n plants of spread s make one disc of radius (s/2)·√n. */
export function clumpRadiusOf(p: YardPlanting, f: SpeciesFacts | undefined, layer: Layer): number {
  const spread = p.spread ?? f?.spread ?? TYPICAL_SIZE[layer].spread
  return (spread / 2) * Math.sqrt(p.count ?? 1)
}

export function lotShape(doc: YardDocument, memo?: ScoreMemo): Shape | null {
  return doc.boundary.length >= 3 ? shapeFor(doc.boundary as Ring, memo) : null
}

// everything of a planting its measure depends on, as one string (the editor edits plantings in place)
function plantingKey(p: YardPlanting, years: number | null): string {
  const grows = phaseOf(p) === 'planned' && years !== null ? `${years}\u0000${p.start}\u0000${p.startSpread}` : ''
  const base = `${p.id}\u0000${p.species ?? ''}\u0000${p.cultivar ?? ''}\u0000${p.label ?? ''}\u0000${p.height}\u0000${grows}`
  return isAreaPlanting(p) ? `${base}\u0000${p.spacing}\u0000${p.z}\u0000${ringKey(p.points as Ring)}` : `${base}\u0000${p.x}\u0000${p.y}\u0000${p.spread}\u0000${p.count}`
}

function sameCutters(a: Cutter[] | undefined, b: Cutter[] | undefined): boolean {
  if (a === b) return true
  if (!a || !b || a.length !== b.length) return false
  for (let i = 0; i < a.length; i++) if (a[i] !== b[i]) return false
  return true
}

/** `facts` with each entry replaced by the memo's equal object, so a planting's facts compare by identity. */
function canonicalFacts(facts: Map<string, SpeciesFacts>, memo: ScoreMemo): Map<string, SpeciesFacts> {
  const out = new Map<string, SpeciesFacts>()
  for (const [key, f] of facts) {
    const known = memo.facts.get(key)
    if (known && sameFacts(known, f)) out.set(key, known)
    else { memo.facts.set(key, f); out.set(key, f) }
  }
  return out
}

/**
 * Status, layer and footprint of every planting. With a memo (the editor's), a planting whose fields, facts,
 * lot, region and — for the ground layer — shapes above are unchanged since the last call keeps its measure:
 * exactly what a fresh measurement gives.
 */
export function measureYard(doc: YardDocument, factsArg: Map<string, SpeciesFacts>, regionArg?: string | null, memo?: ScoreMemo, years: number | null = null): MeasuredYard {
  const region = regionArg ?? doc.region ?? null
  const head: ScoreWarning[] = []
  if (!region) head.push({ id: 'region', message: 'The yard has no state or province, so no plant can be counted as native yet' })
  const lot = lotShape(doc, memo)
  const where = region ? regionName(region) : 'this region'
  const facts = memo ? canonicalFacts(factsArg, memo) : factsArg

  const n = doc.plantings.length
  const keys: Array<string | null> = new Array(n)
  const factsOf: Array<SpeciesFacts | undefined> = new Array(n)
  const layers: Layer[] = new Array(n)
  for (let i = 0; i < n; i++) {
    const p = doc.plantings[i]!
    const key = p.species ? nameKey(p.species) : null
    keys[i] = key
    const f = key ? facts.get(key) : undefined
    factsOf[i] = f
    layers[i] = f?.layer ?? layerBySize(p)
  }
  const shapes = new Map<number, Shape>()
  const cutters = groundCutters(doc, (i) => layers[i] === 'ground', shapes, memo, (i) => clumpRadiusOf(doc.plantings[i]!, factsOf[i], layers[i]!))

  const own: ScoreWarning[][] = new Array(n)
  const plantings = doc.plantings.map((p, index): PlantingMeasure => {
    const f = factsOf[index]
    const above = cutters.get(index)
    const key = memo ? plantingKey(p, years) : ''
    const k = memo?.plantings.get(p)
    if (k && k.key === key && k.facts === f && k.lot === lot && k.region === region && sameCutters(k.above, above)) {
      own[index] = k.warnings
      if (k.measure.index !== index) k.measure = { ...k.measure, index }
      return k.measure
    }
    const warnings: ScoreWarning[] = []
    const measure = measurePlanting(p, index, f, layers[index]!, { lot, region, where, above, own: shapes.get(index), years }, warnings)
    own[index] = warnings
    if (memo) memo.plantings.set(p, { key, facts: f, lot, region, above, measure, warnings } satisfies Remembered)
    return measure
  })
  const warnings = head.slice()
  for (const w of own) for (const x of w) warnings.push(x)
  return { doc, region, lot, plantings, warnings, own }
}

/** Where a planting is measured: the lot, the region (and its name for warnings), and for the ground layer the shapes above it and its own. */
export interface PlantingContext {
  lot: Shape | null; region: string | null; where: string; above?: Cutter[]; own?: Shape
  /** years since planting for plantings still to plant (null or absent: at maturity) */
  years?: number | null
}

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
  const group = p.species ? nameKey(p.species) : nameKey(name)
  const cultivar = typeof p.cultivar === 'string' && p.cultivar.length > 0
  const typical = TYPICAL_SIZE[layer]
  const mownLawn = p.height === undefined && f?.lawn === true && isAreaPlanting(p)
  const matureHeight = mownLawn ? MOWN_LAWN_HEIGHT : p.height ?? f?.height ?? typical.height
  if (mownLawn) warnings.push({ id: p.id, message: `${name} is taken as mown lawn, ${Math.round(MOWN_LAWN_HEIGHT * 100)} cm tall (a default); give its height if it is kept taller` })
  else if (p.height === undefined && (!f || f.estimated.includes('height'))) warnings.push({ id: p.id, message: `The height of ${name} is an estimate (${matureHeight} m); measure or check it` })
  // a planting still to plant, seen before maturity: its size that many years after planting
  const young = ctx.years !== null && ctx.years !== undefined && phaseOf(p) === 'planned'
  const grow = (spread: number) => {
    const g = grownSize(p, layer, f?.growthRate, { spread, height: matureHeight }, ctx.years!)
    if (g.estimated) warnings.push({ id: p.id, message: `USDA PLANTS gives no growth rate for ${name}: a moderate rate (${g.years} years to maturity) is assumed` })
    return g
  }

  if (isAreaPlanting(p)) {
    const spacing = p.spacing !== undefined ? p.spacing : f ? f.spacing : null
    const ring = p.points as Ring
    let area = layer === 'ground' ? visibleArea(ring, lot, ctx.above ?? [], ctx.own).area : areaInLot(ctx.own ?? shapeOf(ring), lot)
    let height = matureHeight
    if (young) {
      // the drift covers its outline at maturity; before, each plant's footprint relative to its mature one
      const mature = f?.spread ?? typical.spread
      const g = grow(mature)
      area *= Math.min(1, (g.spread / mature) ** 2)
      height = g.height
    }
    if (area === 0) warnings.push({ id: p.id, message: layer === 'ground' ? `${name} is outside the lot or wholly covered by shapes drawn above it, so it counts nothing` : `${name} is outside the lot, so it counts nothing` })
    return { index, id: p.id, name, group, status, layer, isArea: true, lawn: f?.lawn === true, cultivar, count: spacing === null ? null : plantsNeeded(area, spacing), area, volume: area * height, spread: null, height, spacing }
  }
  const matureSpread = p.spread ?? f?.spread ?? typical.spread
  if (p.spread === undefined && (!f || f.estimated.includes('spread'))) warnings.push({ id: p.id, message: `The spread of ${name} is an estimate (${matureSpread} m); measure or check it` })
  const g = young ? grow(matureSpread) : null
  const spread = g ? g.spread : matureSpread
  const height = g ? g.height : matureHeight
  const count = p.count ?? 1
  // a clump of n plants is one disc of n plants' footprint, centred on the planting
  const area = circleAreaInLot(p.x!, p.y!, (spread / 2) * Math.sqrt(count), lot)
  const centreIn = !lot || pointInShape([p.x!, p.y!], lot)
  if (!centreIn) warnings.push({ id: p.id, message: `${name} stands outside the lot, so its plants are not counted` })
  return { index, id: p.id, name, group, status, layer, isArea: false, lawn: false, cultivar, count: centreIn ? count : 0, area, volume: area * height, spread, height, spacing: null }
}
