// Moves to the goal, per share, worked out from the measured yard (never guessed): replace invasive plantings
// first (largest first), then close what is left by converting lawn to a native drift (area and volume) or by
// adding k native plants of a typical size. `applyMoves` carries them out on a document, so they can be checked.
import type { Layer, SpeciesFacts } from '../../types/species'
import type { Move, ScoreWarning, ShareKind } from '../../schemas/score'
import type { YardDocument, YardPlanting } from '../../schemas/yard-document'
import { clip, multiPolygonArea, roomiestPoint, visibleGeometry, ringInLot, type Cutter, type Shape, type MultiPolygon } from '../geometry'
import type { Ring } from '../polygon'
import { formatArea, type Units } from '../units'
import { regionName } from '../regions'
import { TYPICAL_SIZE, groundCutters, measureYard, type MeasuredYard, type PlantingMeasure } from './measure'
import { contribution, round3, tallyYard, type YardTally } from './tally'
import { GOAL_TOLERANCE, meetsGoal } from './goal'
import type { ScoreMemo } from './memo'

const SHARES: ShareKind[] = ['count', 'area', 'volume']
const LAYER_WORD: Record<Layer, [string, string]> = { tree: ['tree', 'trees'], shrub: ['shrub', 'shrubs'], ground: ['perennial or grass', 'perennials and grasses'] }

/** Invasive plantings grouped by species, in the order their replacement is proposed: largest contribution first. */
export function invasiveOrder(plantings: PlantingMeasure[], share: ShareKind): PlantingMeasure[][] {
  const groups = new Map<string, PlantingMeasure[]>()
  for (const p of plantings) {
    if (p.status !== 'invasive' || contribution(p, share) <= 0) continue
    const key = p.nameKey
    const group = groups.get(key)
    if (group) group.push(p)
    else groups.set(key, [p])
  }
  const totals = new Map([...groups.values()].map((g) => [g, round3(g.reduce((sum, p) => sum + contribution(p, share), 0))]))
  return [...groups.values()].sort((a, b) => totals.get(b)! - totals.get(a)! || a[0]!.index - b[0]!.index)
}

/** Lawn that can be converted: non-native lawn plantings with visible area, largest first. */
export function lawnOrder(plantings: PlantingMeasure[], skip: Set<number> = new Set()): PlantingMeasure[] {
  return plantings.filter((p) => p.lawn && p.isArea && p.status !== 'native' && p.area > 0 && !skip.has(p.index))
    .sort((a, b) => round3(b.area) - round3(a.area) || a.index - b.index)
}

// the lot's roomiest point; the editor's memo keeps it per lot shape (unchanged while the lot is)
function roomiest(lot: Shape | null, memo?: ScoreMemo): ReturnType<typeof roomiestPoint> {
  if (!lot || !memo) return roomiestPoint(lot)
  let r = memo.roomiest.get(lot)
  if (!r) memo.roomiest.set(lot, (r = roomiestPoint(lot)))
  return r
}

/** The layer of the plants an add-plants move proposes: small plants for the count; for cover and volume the largest that fits the lot. */
export function addPlantsLayer(share: ShareKind, lot: Shape | null, memo?: ScoreMemo): Layer {
  if (share === 'count') return 'ground'
  const room = roomiest(lot, memo).clearance
  return (['tree', 'shrub', 'ground'] as Layer[]).find((l) => TYPICAL_SIZE[l].spread / 2 <= room) ?? 'ground'
}

// what one m² of lawn turned into a typical native drift adds to the native side, less goal × what it adds to the total
function lawnRate(share: ShareKind, lawn: PlantingMeasure, goal: number): number {
  const drift = TYPICAL_SIZE.ground
  if (share === 'area') return 1
  return drift.height * (1 - goal) + goal * lawn.height
}

// rounded up to 0.1 m² so that the amount shown still closes the gap (less floating-point dust)
const ceilTenth = (x: number) => Math.ceil(x * 10 - 1e-9) / 10
// metres first (the amount's unit), the yard's own units beside when it is drawn in feet
const areaWords = (m2: number, units: Units) => `${formatArea(m2, 'm', m2 < 10 ? 1 : 0)}${units === 'ft' ? ` (${formatArea(m2, 'ft')})` : ''}`

export function movesToGoal(measured: MeasuredYard, goal: number, tally: YardTally = tallyYard(measured.plantings), memo?: ScoreMemo): { moves: Move[]; warnings: ScoreWarning[] } {
  const moves: Move[] = []
  const warnings: ScoreWarning[] = []
  const units: Units = measured.doc.units ?? 'm'
  const where = measured.region ? regionName(measured.region) : 'this region'
  for (const share of SHARES) {
    let native = tally.native[share]
    const total = tally.total[share]
    // an empty share has nothing to close; a share at the goal meets it
    if (total === 0 || meetsGoal(native / total, goal)) continue
    const replaced = new Set<number>()
    for (const group of invasiveOrder(tally.invasive, share)) {
      if (meetsGoal(native / total, goal)) break
      for (const p of group) { native += contribution(p, share); replaced.add(p.index) }
      const { name, layer } = group[0]!
      const word = LAYER_WORD[layer]
      const where2 = `${name} (invasive in ${where})`
      const spots = group.length > 1 ? ` in ${group.length} places` : ''
      if (group.some((p) => p.isArea)) {
        const area = group.reduce((sum, p) => sum + p.area, 0)
        moves.push({ share, kind: 'replace-invasive', amount: round3(area), unit: 'm2', text: `Replace the ${areaWords(area, units)} of ${where2}${spots} with native ${word[1]}` })
      } else {
        const plants = group.reduce((sum, p) => sum + (p.count ?? 0), 0)
        moves.push({ share, kind: 'replace-invasive', amount: plants, unit: 'plants', text: `Replace the ${plants === 1 ? '' : `${plants} `}${where2}${spots} with ${plants === 1 ? `a native ${word[0]}` : `native ${word[1]}`} of about the same size` })
      }
    }
    if (meetsGoal(native / total, goal)) continue
    const gap = goal * total - native

    if (share !== 'count') {
      // what is left to close, done when within meetsGoal's tolerance
      let need = gap
      let amount = 0
      for (const lawn of lawnOrder(tally.lawn, replaced)) {
        const rate = lawnRate(share, lawn, goal)
        const take = Math.min(lawn.area, need / rate)
        amount += take
        need -= take * rate
        if (need <= GOAL_TOLERANCE * total) break
      }
      if (need <= GOAL_TOLERANCE * total) {
        const a = ceilTenth(amount)
        moves.push({ share, kind: 'convert-lawn', amount: a, unit: 'm2', text: `Turn ${areaWords(a, units)} of lawn into a native drift` })
        continue
      }
    }
    if (goal >= 1) {
      warnings.push({ id: 'goal', message: `A goal of 100 % by ${share} is met only by replacing every plant that is not native` })
      continue
    }
    const layer = addPlantsLayer(share, measured.lot, memo)
    const size = TYPICAL_SIZE[layer]
    const perPlant = share === 'count' ? 1 : Math.PI * (size.spread / 2) ** 2 * (share === 'volume' ? size.height : 1)
    // k native plants raise native and total alike: native + k·a ≥ goal·(total + k·a)  ⇔  k ≥ gap / ((1 − goal)·a)
    const k = Math.max(1, Math.ceil(gap / ((1 - goal) * perPlant)))
    const word = LAYER_WORD[layer]
    moves.push({ share, kind: 'add-plants', amount: k, unit: 'plants', text: `Add ${k} native ${k === 1 ? word[0] : word[1]} about ${size.spread} m across` })
  }
  return { moves, warnings }
}

/**
 * Carries out one share's moves on a copy of the document: replaced plantings take `nativeFor(layer)` at their
 * own size; converted lawn becomes a drift drawn just above it (cut from the lawn's top edge down); added plants
 * go in clumps where their whole footprint lies in the lot.
 */
export function applyMoves(doc: YardDocument, facts: Map<string, SpeciesFacts>, moves: Move[], nativeFor: (layer: Layer) => string, region?: string | null): YardDocument {
  if (!moves.length) return doc
  const share = moves[0]!.share
  const out: YardDocument = { ...doc, plantings: doc.plantings.map((p) => ({ ...p })) }
  const measured = measureYard(doc, facts, region)
  const replaced = new Set<number>()
  const replaceCount = moves.filter((m) => m.kind === 'replace-invasive').length
  for (const p of invasiveOrder(measured.plantings, share).slice(0, replaceCount).flat()) {
    replaced.add(p.index)
    const target = out.plantings[p.index]!
    Object.assign(target, { species: nativeFor(p.layer), cultivar: null, height: p.height }, p.isArea ? { spacing: p.spacing } : { spread: p.spread })
  }
  const inserts: Array<{ after: number; plantings: YardPlanting[] }> = []
  const convert = moves.find((m) => m.kind === 'convert-lawn')
  if (convert) {
    let left = convert.amount
    const cutters = groundCutters(doc, (i) => measured.plantings[i]!.layer === 'ground')
    const drift = TYPICAL_SIZE.ground
    for (const lawn of lawnOrder(measured.plantings, replaced)) {
      if (left <= 0) break
      const target = out.plantings[lawn.index]!
      const asDrift = { species: nativeFor('ground'), cultivar: null, spacing: drift.spacing, height: drift.height }
      const pieces = left < lawn.area ? slabOf(target.points as Ring, measured.lot, cutters.get(lawn.index) ?? [], left) : null
      if (!pieces) Object.assign(target, asDrift)
      else inserts.push({ after: lawn.index, plantings: pieces.map((ring, i) => ({ id: `${lawn.id}-drift-${i + 1}`, ...asDrift, z: target.z, points: ring })) })
      left -= lawn.area
    }
  }
  for (const ins of inserts.sort((a, b) => b.after - a.after)) out.plantings.splice(ins.after + 1, 0, ...ins.plantings)
  const add = moves.find((m) => m.kind === 'add-plants')
  if (add) {
    const layer = addPlantsLayer(share, measured.lot)
    const size = TYPICAL_SIZE[layer]
    const { point, clearance } = roomiest(measured.lot)
    // a clump of c plants is a disc of radius r·√c: as many per clump as fit inside the clearance
    const perClump = Math.max(1, Math.floor(Math.min(1e6, (clearance / (size.spread / 2)) ** 2) * (1 - 1e-9)))
    let left = add.amount
    for (let i = 1; left > 0; i++) {
      const count = Math.min(left, perClump)
      out.plantings.push({ id: `added-${share}-${i}`, species: nativeFor(layer), cultivar: null, x: point[0], y: point[1], count, spread: size.spread, height: size.height })
      left -= count
    }
  }
  return out
}

// The part of a lawn to redraw as a drift: its outline in the lot, cut by a horizontal line placed so that the
// visible lawn above the line is at least `area`. Null when the piece is not a plain outline (then convert all).
function slabOf(ring: Ring, lot: Shape | null, cutters: Cutter[], area: number): Ring[] | null {
  const visible = visibleGeometry(ring, lot, cutters)
  const inLot = ringInLot(ring, lot).geom
  let minY = Infinity, maxY = -Infinity, minX = Infinity, maxX = -Infinity
  for (const poly of inLot) for (const [x, y] of poly[0]!) { minY = Math.min(minY, y); maxY = Math.max(maxY, y); minX = Math.min(minX, x); maxX = Math.max(maxX, x) }
  const above = (y: number): Ring => [[minX - 1, minY - 1], [maxX + 1, minY - 1], [maxX + 1, y], [minX - 1, y]]
  const areaAbove = (y: number) => multiPolygonArea(clip.intersection(visible, [above(y)]))
  let lo = minY
  let hi = maxY
  for (let i = 0; i < 60 && hi - lo > 1e-9; i++) {
    const mid = (lo + hi) / 2
    if (areaAbove(mid) >= area) hi = mid
    else lo = mid
  }
  const pieces: MultiPolygon = clip.intersection(inLot, [above(hi)])
  if (pieces.some((poly) => poly.length !== 1)) return null
  return pieces.map((poly) => poly[0]!.slice(0, -1) as Ring)
}
