// Moves to the goal, per share, worked out from the measured yard (never guessed), each the smallest that
// reaches the goal: replace invasive plantings first (the smallest group that closes the gap, else the largest
// and go on), then convert lawn to a native drift (area and volume; the lawn that gains most per m² first), or
// add the fewest native plants that fit the open ground. `applyMoves` carries them out on a document, so they
// can be checked.
import type { Layer, SpeciesFacts } from '../../types/species'
import type { Move, ScoreWarning, ShareKind } from '../../schemas/score'
import type { YardDocument, YardPlanting } from '../../schemas/yard-document'
import { areaInLot, clip, distanceToRing, multiPolygonArea, roomiestPoint, visibleGeometry, ringInLot, type Cutter, type Shape, type MultiPolygon } from '../geometry'
import { pointInRing, type Point, type Ring } from '../polygon'
import { areaAtLeast, formatLength, type Units } from '../units'
import { regionName } from '../regions'
import { TYPICAL_SIZE, groundCutters, measureYard, shapeFor, type MeasuredYard, type PlantingMeasure } from './measure'
import { contribution, tallyYard, type YardTally } from './tally'
import { meetsGoal } from './goal'
import type { ScoreMemo } from './memo'

const SHARES: ShareKind[] = ['count', 'area', 'volume']
const SHARE_WORD: Record<ShareKind, string> = { count: 'plant count', area: 'cover', volume: 'volume' }
const LAYER_WORD: Record<Layer, [string, string]> = { tree: ['tree', 'trees'], shrub: ['shrub', 'shrubs'], ground: ['perennial or grass', 'perennials and grasses'] }
const HARD_KINDS = new Set(['building', 'paving', 'water'])

/** Invasive plantings grouped by species (first seen first), with each group's contribution to the share. */
export function invasiveGroups(plantings: PlantingMeasure[], share: ShareKind): Array<{ plantings: PlantingMeasure[]; total: number }> {
  const groups = new Map<string, { plantings: PlantingMeasure[]; total: number }>()
  for (const p of plantings) {
    const c = p.status === 'invasive' ? contribution(p, share) : 0
    if (c <= 0) continue
    const group = groups.get(p.group)
    if (group) { group.plantings.push(p); group.total += c } else groups.set(p.group, { plantings: [p], total: c })
  }
  return [...groups.values()]
}

/**
 * The invasive groups to replace, in order: while the goal is not met, the smallest group that alone meets it,
 * else the largest (and go on). Replacing changes a planting's status only, so the total stays.
 */
export function invasivePicks(plantings: PlantingMeasure[], share: ShareKind, native: number, total: number, goal: number): PlantingMeasure[][] {
  const left = invasiveGroups(plantings, share)
  const picks: PlantingMeasure[][] = []
  let n = native
  while (left.length && !meetsGoal(n / total, goal)) {
    let pick = -1
    for (let i = 0; i < left.length; i++) {
      if (meetsGoal((n + left[i]!.total) / total, goal) && (pick < 0 || left[i]!.total < left[pick]!.total)) pick = i
    }
    if (pick < 0) for (let i = 0; i < left.length; i++) if (pick < 0 || left[i]!.total > left[pick]!.total) pick = i
    const [g] = left.splice(pick, 1)
    n += g!.total
    picks.push(g!.plantings)
  }
  return picks
}

/**
 * Lawn that can be converted, in the order that needs the least: non-native lawn with visible area. For the
 * volume the taller lawn first (each m² gains drift height·(1 − goal) + goal·lawn height), then the larger.
 */
export function lawnOrder(plantings: PlantingMeasure[], skip: Set<number> = new Set(), share: ShareKind = 'area'): PlantingMeasure[] {
  return plantings.filter((p) => p.lawn && p.isArea && p.status !== 'native' && p.area > 0 && !skip.has(p.index))
    .sort((a, b) => (share === 'volume' ? b.height - a.height : 0) || b.area - a.area || a.index - b.index)
}

// what one m² of lawn turned into a typical native drift adds to the native side, less goal × what it adds to the total
function lawnRate(share: ShareKind, lawn: PlantingMeasure, goal: number): number {
  if (share === 'area') return 1
  return TYPICAL_SIZE.ground.height * (1 - goal) + goal * lawn.height
}

/** The least lawn (m², exact) whose conversion meets the goal, or null when all the lawn is not enough. */
export function lawnNeeded(lawns: PlantingMeasure[], share: ShareKind, native: number, total: number, goal: number): number | null {
  const meets = (n: number, t: number) => meetsGoal(n / t, goal)
  let n = native
  let t = total
  let amount = 0
  const drift = TYPICAL_SIZE.ground.height
  for (const lawn of lawns) {
    const perM2 = { native: share === 'area' ? 1 : drift, total: share === 'area' ? 0 : drift - lawn.height }
    // the area of this lawn that closes the gap: n + a·dn = goal·(t + a·dt)
    const take = (goal * t - n) / lawnRate(share, lawn, goal)
    if (take <= lawn.area) return amount + Math.max(0, take)
    amount += lawn.area
    n += lawn.area * perM2.native
    t += lawn.area * perM2.total
  }
  return meets(n, t) ? amount : null
}

/** The fewest plants, each adding `each` to native and total, that bring native/total to the goal. */
export function plantsNeeded(native: number, total: number, each: number, goal: number): number {
  if (goal >= 1) return Infinity
  const meets = (k: number) => meetsGoal((native + k * each) / (total + k * each), goal)
  // k ≥ (goal·total − native) / ((1 − goal)·each), then checked by meetsGoal itself (no ceil off by one)
  let k = Math.max(1, Math.ceil((goal * total - native) / ((1 - goal) * each)))
  while (k > 1 && meets(k - 1)) k--
  while (!meets(k)) k++
  return k
}

// the lot's roomiest point; the editor's memo keeps it per lot shape (unchanged while the lot is)
function roomiest(lot: Shape | null, memo?: ScoreMemo): ReturnType<typeof roomiestPoint> {
  if (!lot || !memo) return roomiestPoint(lot)
  let r = memo.roomiest.get(lot)
  if (!r) memo.roomiest.set(lot, (r = roomiestPoint(lot)))
  return r
}

/**
 * Open ground (m²): the lot less buildings, paving and water and less every planting's footprint (lawn
 * included: planting there is converting lawn). Overlaps are taken off twice, so it errs small. Infinite with no lot.
 */
export function openGround(measured: MeasuredYard, memo?: ScoreMemo): number {
  const { lot, doc } = measured
  if (!lot) return Infinity
  let used = 0
  for (const a of doc.areas) if (HARD_KINDS.has(a.kind)) used += areaInLot(shapeFor(a.points as Ring, memo), lot)
  for (const p of measured.plantings) used += p.area
  return Math.max(0, lot.area - used)
}

const footprint = (layer: Layer) => Math.PI * (TYPICAL_SIZE[layer].spread / 2) ** 2
const perPlant = (share: ShareKind, layer: Layer) => (share === 'count' ? 1 : footprint(layer) * (share === 'volume' ? TYPICAL_SIZE[layer].height : 1))

/**
 * The add-plants move's plants: for the count, perennials; for cover and volume the largest layer whose plant
 * fits the lot's roomiest spot and whose k plants fit the open ground (perennials, which would sit on other
 * ground-layer plants, are not proposed there). Null when none fits.
 */
export function addPlantsChoice(share: ShareKind, native: number, total: number, goal: number, room: { clearance: number; open: number }): { layer: Layer; k: number; fits: boolean } | null {
  if (share === 'count') {
    const k = plantsNeeded(native, total, 1, goal)
    return { layer: 'ground', k, fits: k * footprint('ground') <= room.open }
  }
  for (const layer of ['tree', 'shrub'] as Layer[]) {
    if (TYPICAL_SIZE[layer].spread / 2 > room.clearance) continue
    const k = plantsNeeded(native, total, perPlant(share, layer), goal)
    if (k * footprint(layer) <= room.open) return { layer, k, fits: true }
  }
  return null
}

function replaceMove(share: ShareKind, group: PlantingMeasure[], where: string, units: Units): Move {
  const { name, layer } = group[0]!
  const word = LAYER_WORD[layer]
  const what = `${name} (invasive in ${where})`
  const spots = group.length > 1 ? ` in ${group.length} places` : ''
  const ids = group.map((p) => p.id)
  if (group.some((p) => p.isArea)) {
    const area = areaAtLeast(group.reduce((sum, p) => sum + p.area, 0), units)
    return { share, kind: 'replace-invasive', amount: area.squareMetres, unit: 'm2', plantings: ids, text: `Replace the ${area.text} of ${what}${spots} with native ${word[1]}` }
  }
  const plants = group.reduce((sum, p) => sum + (p.count ?? 0), 0)
  return { share, kind: 'replace-invasive', amount: plants, unit: 'plants', plantings: ids, text: `Replace the ${plants === 1 ? '' : `${plants} `}${what}${spots} with ${plants === 1 ? `a native ${word[0]}` : `native ${word[1]}`} of about the same size` }
}

function addPlantsMove(share: ShareKind, choice: { layer: Layer; k: number; fits: boolean }, lawnLeft: number, units: Units): Move | ScoreWarning {
  const { layer, k, fits } = choice
  const size = TYPICAL_SIZE[layer]
  const plants = `${k} native ${k === 1 ? LAYER_WORD[layer][0] : LAYER_WORD[layer][1]} about ${formatLength(size.spread, units)} across`
  if (fits) return { share, kind: 'add-plants', amount: k, unit: 'plants', layer, text: `Add ${plants}` }
  const ground = k * footprint(layer)
  if (ground <= lawnLeft) {
    const bed = areaAtLeast(ground, units)
    return { share, kind: 'add-plants', amount: k, unit: 'plants', layer, text: `Add ${plants}: the lot has no open ground for them, so turn about ${bed.text} of lawn into a bed for them` }
  }
  return roomWarning(share)
}

const roomWarning = (share: ShareKind): ScoreWarning => ({ id: 'room', message: `Reaching the goal by ${SHARE_WORD[share]} needs more native plants than the lot's open ground holds: turn lawn or paving into planting beds, or replace plants that are not native` })

export function movesToGoal(measured: MeasuredYard, goal: number, tally: YardTally = tallyYard(measured.plantings), memo?: ScoreMemo): { moves: Move[]; warnings: ScoreWarning[] } {
  const moves: Move[] = []
  const warnings: ScoreWarning[] = []
  const units: Units = measured.doc.units ?? 'm'
  const where = measured.region ? regionName(measured.region) : 'this region'
  let room: { clearance: number; open: number } | null = null
  for (const share of SHARES) {
    let native = tally.native[share]
    const total = tally.total[share]
    // an empty share has nothing to close; a share at the goal meets it
    if (total === 0 || meetsGoal(native / total, goal)) continue
    const replaced = new Set<number>()
    for (const group of invasivePicks(tally.invasive, share, native, total, goal)) {
      for (const p of group) { native += contribution(p, share); replaced.add(p.index) }
      moves.push(replaceMove(share, group, where, units))
    }
    if (meetsGoal(native / total, goal)) continue
    const lawns = lawnOrder(tally.lawn, replaced, share)
    if (share !== 'count') {
      const need = lawnNeeded(lawns, share, native, total, goal)
      if (need !== null) {
        const a = areaAtLeast(need, units)
        moves.push({ share, kind: 'convert-lawn', amount: a.squareMetres, unit: 'm2', text: `Turn ${a.text} of lawn into a native drift` })
        continue
      }
    }
    if (goal >= 1) {
      warnings.push({ id: 'goal', message: `A goal of 100 % by ${SHARE_WORD[share]} is met only by replacing every plant that is not native` })
      continue
    }
    room ??= { clearance: roomiest(measured.lot, memo).clearance, open: openGround(measured, memo) }
    const choice = addPlantsChoice(share, native, total, goal, room)
    const move = choice ? addPlantsMove(share, choice, lawns.reduce((sum, l) => sum + l.area, 0), units) : roomWarning(share)
    if ('kind' in move) moves.push(move)
    else warnings.push(move)
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
  const replacedIds = new Set(moves.flatMap((m) => (m.kind === 'replace-invasive' ? m.plantings ?? [] : [])))
  const replaced = new Set<number>()
  for (const p of measured.plantings) {
    if (!replacedIds.has(p.id)) continue
    replaced.add(p.index)
    const target = out.plantings[p.index]!
    Object.assign(target, { species: nativeFor(p.layer), cultivar: null, height: p.height }, p.isArea ? { spacing: p.spacing } : { spread: p.spread })
  }
  const inserts: Array<{ after: number; plantings: YardPlanting[] }> = []
  const convert = moves.find((m) => m.kind === 'convert-lawn')
  if (convert) {
    let left = convert.amount
    const cutters = groundCutters(doc, (i) => measured.plantings[i]!.layer === 'ground', new Map(), undefined, (i) => { const m = measured.plantings[i]!; return m.isArea ? null : (m.spread! / 2) * Math.sqrt(doc.plantings[i]!.count ?? 1) })
    const drift = TYPICAL_SIZE.ground
    for (const lawn of lawnOrder(measured.plantings, replaced, share)) {
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
    const layer = add.layer ?? (share === 'count' ? 'ground' : 'shrub')
    const size = TYPICAL_SIZE[layer]
    const { point, clearance } = layer === 'ground' ? openSpot(measured) : roomiest(measured.lot)
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

// The roomiest spot for new perennials (on a grid, good to a step): in the lot, off buildings, paving, water and
// ground-layer plantings other than sodded or sown lawn (planting there converts it), so the clumps cut nothing counted.
function openSpot(measured: MeasuredYard, steps = 40): { point: Point; clearance: number } {
  const { lot, doc } = measured
  if (!lot) return roomiestPoint(lot)
  const taken: Ring[] = doc.areas.filter((a) => HARD_KINDS.has(a.kind)).map((a) => a.points as Ring)
  for (const m of measured.plantings) if (m.layer === 'ground' && m.isArea && !(m.lawn && m.count === null)) taken.push(doc.plantings[m.index]!.points as Ring)
  const { minX, minY, maxX, maxY } = lot.box
  let best = { point: lot.ring[0]! as Point, clearance: 0 }
  for (let i = 1; i < steps; i++) {
    for (let j = 1; j < steps; j++) {
      const p: Point = [minX + ((maxX - minX) * i) / steps, minY + ((maxY - minY) * j) / steps]
      if (!pointInRing(p, lot.ring) || taken.some((r) => pointInRing(p, r))) continue
      let d = distanceToRing(p, lot.ring)
      for (const r of taken) d = Math.min(d, distanceToRing(p, r))
      for (const m of measured.plantings) if (m.layer === 'ground' && !m.isArea) d = Math.min(d, Math.hypot(p[0] - doc.plantings[m.index]!.x!, p[1] - doc.plantings[m.index]!.y!) - Math.sqrt(m.area / Math.PI))
      if (d > best.clearance) best = { point: p, clearance: d }
    }
  }
  return best
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
