// The yard editor's pure document edits and geometry: snapping, ids, finding, moving, copying, deleting and
// layering elements, hit-testing and bounds. The editor store (app/stores/editor.ts) applies them through its
// one undoable change; tests and other features can call them on any document.
import { isAreaPlanting, phaseOf, PHASES, type Phase, type YardArea, type YardDocument, type YardLine, type YardPlanting } from '../schemas/yard-document'
import { METRES_PER_FOOT, type Units } from './units'
import { pointInRing, ringArea, type Point } from './polygon'
import { boxOf, distanceToSegment, type Box } from './geometry'
import { plantsNeeded } from './plant-count'

export const LOT_ID = 'lot'

/** An element of the document as the editor selects it. */
export type Element =
  | { type: 'lot'; id: 'lot'; points: Point[] }
  | { type: 'area'; id: string; item: YardArea }
  | { type: 'planting'; id: string; item: YardPlanting }
  | { type: 'line'; id: string; item: YardLine }

// ---------- document edits ----------

/** Grid step for snapping: half a foot, or ten centimetres, in metres. */
export function snapStep(units: Units): number {
  return units === 'ft' ? 0.5 * METRES_PER_FOOT : 0.1
}

export function snapValue(v: number, step: number): number {
  // round to the grid, then to a micrometre so that 0.1 m steps do not drift into 0.30000000000000004
  return Math.round(Math.round(v / step) * step * 1e6) / 1e6
}

export function snapPoint(p: Point, step: number): Point {
  return [snapValue(p[0], step), snapValue(p[1], step)]
}

/** Sets the phase of areas and plantings (lines and the lot have none); "there now" is stored as no phase. */
export function setPhase(doc: YardDocument, ids: Iterable<string>, phase: Phase): boolean {
  const want = new Set(ids)
  let changed = false
  for (const el of [...doc.areas, ...doc.plantings]) {
    if (!want.has(el.id) || phaseOf(el) === phase) continue
    if (phase === 'existing') delete el.phase
    else el.phase = phase
    delete el.doneOn
    changed = true
  }
  return changed
}

/** The phase after `phase` in the order there now → to plant → to remove → there now (one key steps through). */
export const nextPhase = (phase: Phase): Phase => PHASES[(PHASES.indexOf(phase) + 1) % PHASES.length]!

/** Why work cannot be marked done on one of the ids (its index in the list, for the field name). */
export class WorkError extends Error {
  constructor(readonly index: number, message: string) { super(message) }
}

/**
 * Work marked done, in place: planted turns what is to plant into what is there now (with the date), removed
 * drops what was to remove. Throws WorkError naming the first id that cannot take it (then nothing is changed).
 */
export function markWorkDone(doc: YardDocument, work: { action: 'planted' | 'removed'; ids: string[]; date: string }): void {
  const els = work.ids.map((id, i) => {
    const el = doc.plantings.find((p) => p.id === id) ?? doc.areas.find((a) => a.id === id)
    if (!el) throw new WorkError(i, `There is no planting or area "${id}" in the plan`)
    const phase = phaseOf(el)
    if (work.action === 'planted' && phase === 'removing') throw new WorkError(i, `"${id}" is to remove: it cannot be marked planted`)
    if (work.action === 'planted' && phase === 'existing') throw new WorkError(i, `"${id}" is there already: only something to plant can be marked planted`)
    if (work.action === 'removed' && phase !== 'removing') throw new WorkError(i, `"${id}" is not marked to remove: mark it to remove first`)
    return el
  })
  if (work.action === 'planted') for (const el of els) { delete el.phase; el.doneOn = work.date }
  else deleteElements(doc, work.ids)
}

/** Plants in a drift at its on-centre spacing (triangular layout; `plantsNeeded`, as the score counts them). */
export function driftPlantCount(points: Point[], spacing: number | null | undefined): number | null {
  if (!spacing) return null
  return plantsNeeded(ringArea(points), spacing)
}

export function newId(prefix: string, taken: Set<string>): string {
  for (;;) {
    const id = `${prefix}${Math.random().toString(36).slice(2, 8)}`
    if (!taken.has(id)) return id
  }
}

export function allIds(doc: YardDocument): Set<string> {
  return new Set([LOT_ID, ...doc.areas.map((a) => a.id), ...doc.plantings.map((p) => p.id), ...doc.lines.map((l) => l.id)])
}

export function findElement(doc: YardDocument, id: string): Element | null {
  if (id === LOT_ID) return doc.boundary.length ? { type: 'lot', id: LOT_ID, points: doc.boundary as Point[] } : null
  const area = doc.areas.find((a) => a.id === id)
  if (area) return { type: 'area', id, item: area }
  const planting = doc.plantings.find((p) => p.id === id)
  if (planting) return { type: 'planting', id, item: planting }
  const line = doc.lines.find((l) => l.id === id)
  if (line) return { type: 'line', id, item: line }
  return null
}

/** Moves every point of the listed elements by (dx, dy) metres. */
export function translateElements(doc: YardDocument, ids: Iterable<string>, dx: number, dy: number): void {
  const move = (pts: Point[]) => pts.forEach((p) => { p[0] += dx; p[1] += dy })
  for (const id of ids) {
    const el = findElement(doc, id)
    if (!el) continue
    if (el.type === 'lot') move(doc.boundary as Point[])
    else if (el.type === 'planting' && !isAreaPlanting(el.item)) { el.item.x = (el.item.x ?? 0) + dx; el.item.y = (el.item.y ?? 0) + dy }
    else move((el.item as { points: Point[] }).points)
  }
}

/** Copies of the listed elements (not the lot), offset by (dx, dy), with fresh ids. Returns the new ids. */
export function duplicateElements(doc: YardDocument, ids: string[], dx: number, dy: number): string[] {
  const taken = allIds(doc)
  const created: string[] = []
  for (const id of ids) {
    const el = findElement(doc, id)
    if (!el || el.type === 'lot') continue
    const copy = JSON.parse(JSON.stringify(el.item)) as typeof el.item
    copy.id = newId(el.type === 'area' ? 'a' : el.type === 'planting' ? 'p' : 'l', taken)
    taken.add(copy.id)
    if (el.type === 'area') doc.areas.push(copy as YardArea)
    else if (el.type === 'planting') doc.plantings.push(copy as YardPlanting)
    else doc.lines.push(copy as YardLine)
    created.push(copy.id)
  }
  translateElements(doc, created, dx, dy)
  return created
}

export function deleteElements(doc: YardDocument, ids: Iterable<string>): void {
  const gone = new Set(ids)
  if (gone.has(LOT_ID)) doc.boundary = []
  doc.areas = doc.areas.filter((a) => !gone.has(a.id))
  doc.plantings = doc.plantings.filter((p) => !gone.has(p.id))
  doc.lines = doc.lines.filter((l) => !gone.has(l.id))
}

/** The drawing order of areas and area plantings: by z, then by position in their list (later on top). */
export function layeredShapes(doc: YardDocument): Array<YardArea | (YardPlanting & { points: Point[] })> {
  const items: Array<{ item: YardArea | (YardPlanting & { points: Point[] }); z: number; order: number }> = []
  doc.areas.forEach((a, i) => items.push({ item: a, z: a.z ?? 0, order: i }))
  doc.plantings.forEach((p, i) => { if (isAreaPlanting(p)) items.push({ item: p, z: p.z ?? 0, order: 10_000 + i }) })
  return items.sort((a, b) => a.z - b.z || a.order - b.order).map((x) => x.item)
}

/** Renumbers z so that the listed shapes move one step up (or down) past their neighbour. */
export function shiftZ(doc: YardDocument, ids: string[], direction: 1 | -1): void {
  const order = layeredShapes(doc)
  const moving = new Set(ids)
  const list = direction === 1 ? [...order].reverse() : [...order]
  // bubble each moving shape past the next non-moving one
  for (let i = 1; i < list.length; i++) {
    if (moving.has(list[i]!.id) && !moving.has(list[i - 1]!.id)) [list[i - 1], list[i]] = [list[i]!, list[i - 1]!]
  }
  const final = direction === 1 ? list.reverse() : list
  final.forEach((item, i) => { item.z = i })
}

// ---------- geometry for hit-testing and cautions ----------

export function distanceToPolyline(p: Point, pts: Point[], closed = false): number {
  let best = Infinity
  const n = pts.length
  for (let i = 0; i < (closed ? n : n - 1); i++) best = Math.min(best, distanceToSegment(p, pts[i]!, pts[(i + 1) % n]!))
  return best
}

/** 0 inside the polygon, else the distance to its edge. */
export function distanceToPolygon(p: Point, pts: Point[]): number {
  return pointInRing(p, pts) ? 0 : distanceToPolyline(p, pts, true)
}

/** The bounding box of some points. */
export const boundsOf = (points: Point[]): Box => boxOf(points)

/** Radius drawn for a point planting: one plant's spread, or a clump of `count` plants with the same area. */
export function plantRadius(p: YardPlanting, fallbackSpread = 1): number {
  return ((p.spread ?? fallbackSpread) / 2) * Math.sqrt(Math.max(1, p.count ?? 1))
}

export function elementBounds(doc: YardDocument, id: string): Box | null {
  const el = findElement(doc, id)
  if (!el) return null
  if (el.type === 'lot') return boundsOf(el.points)
  if (el.type === 'planting' && !isAreaPlanting(el.item)) {
    const r = plantRadius(el.item)
    const x = el.item.x ?? 0
    const y = el.item.y ?? 0
    return { minX: x - r, minY: y - r, maxX: x + r, maxY: y + r }
  }
  return boundsOf((el.item as { points: Point[] }).points)
}

/**
 * The topmost element under a point: point plantings first (smallest on top), then lines, then areas and
 * drifts from the top of the z-order, then the lot's edge. `tolerance` is in metres (a few pixels).
 */
export function hitTest(doc: YardDocument, p: Point, tolerance: number): string | null {
  let best: { id: string; r: number } | null = null
  for (const pl of doc.plantings) {
    if (isAreaPlanting(pl)) continue
    const r = plantRadius(pl)
    const d = Math.hypot(p[0] - (pl.x ?? 0), p[1] - (pl.y ?? 0))
    if (d <= r + tolerance && (!best || r < best.r)) best = { id: pl.id, r }
  }
  if (best) return best.id
  for (const line of doc.lines) if (distanceToPolyline(p, line.points as Point[]) <= tolerance * 2) return line.id
  const shapes = layeredShapes(doc)
  for (let i = shapes.length - 1; i >= 0; i--) if (pointInRing(p, shapes[i]!.points as Point[])) return shapes[i]!.id
  if (doc.boundary.length && distanceToPolyline(p, doc.boundary as Point[], true) <= tolerance * 2) return LOT_ID
  return null
}

/** Ids of elements whose bounds lie wholly inside the box (the lot only when asked). */
export function elementsInBox(doc: YardDocument, box: Box): string[] {
  const inside = (b: Box | null) => !!b && b.minX >= box.minX && b.maxX <= box.maxX && b.minY >= box.minY && b.maxY <= box.maxY
  return [...doc.areas, ...doc.plantings, ...doc.lines].map((e) => e.id).filter((id) => inside(elementBounds(doc, id)))
}
