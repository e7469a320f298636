// Footprint geometry for the score: circles as polygons, clipping to the lot, cutting the ground layer by
// what is drawn above it. Exact analytic answers first (a shape wholly inside or wholly apart); polygon-clipping
// only where shapes really cross. Points are [x, y] in metres, y down.
import polygonClipping from 'polygon-clipping'
import { ringArea, pointInRing, segmentsIntersect, type Point, type Ring } from './polygon'

export type { Point, Ring }
export type Polygon = Ring[]
export type MultiPolygon = Polygon[]
export interface Box { minX: number; minY: number; maxX: number; maxY: number }

export { ringArea }

/** Sides of a circle drawn as a polygon: 96 keeps the inscribed polygon's area error at 0.071 % (< 0.1 %). */
export const CIRCLE_SEGMENTS = 96

// the polygon's vertices sit a little outside the circle so that its area equals πr² exactly
const CIRCLE_AREA_SCALE = Math.sqrt((2 * Math.PI / CIRCLE_SEGMENTS) / Math.sin(2 * Math.PI / CIRCLE_SEGMENTS))
let unitCircle: Ring | null = null
function unitCircleRing(): Ring {
  if (!unitCircle) {
    unitCircle = Array.from({ length: CIRCLE_SEGMENTS }, (_, i): Point => {
      const a = (2 * Math.PI * i) / CIRCLE_SEGMENTS
      return [Math.cos(a) * CIRCLE_AREA_SCALE, Math.sin(a) * CIRCLE_AREA_SCALE]
    })
  }
  return unitCircle
}

const circleCache = new Map<string, Ring>()
const CIRCLE_CACHE_LIMIT = 20_000

/** A circle as a 96-sided polygon of the same area (cached: the editor re-scores the same circles often). */
export function circleRing(cx: number, cy: number, r: number): Ring {
  const key = `${cx},${cy},${r}`
  let ring = circleCache.get(key)
  if (!ring) {
    ring = unitCircleRing().map(([ux, uy]): Point => [cx + ux * r, cy + uy * r])
    if (circleCache.size >= CIRCLE_CACHE_LIMIT) circleCache.clear()
    circleCache.set(key, ring)
  }
  return ring
}

export function multiPolygonArea(mp: MultiPolygon): number {
  let sum = 0
  for (const poly of mp) {
    if (!poly.length) continue
    sum += ringArea(poly[0]!)
    for (let i = 1; i < poly.length; i++) sum -= ringArea(poly[i]!)
  }
  return sum
}

export function boxOf(ring: Ring): Box {
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity
  for (const [x, y] of ring) {
    if (x < minX) minX = x
    if (x > maxX) maxX = x
    if (y < minY) minY = y
    if (y > maxY) maxY = y
  }
  return { minX, minY, maxX, maxY }
}

/** Boxes whose interiors overlap (touching edges do not). */
export function boxesOverlap(a: Box, b: Box): boolean {
  return a.minX < b.maxX && b.minX < a.maxX && a.minY < b.maxY && b.minY < a.maxY
}

function boxInside(inner: Box, outer: Box): boolean {
  return inner.minX >= outer.minX && inner.maxX <= outer.maxX && inner.minY >= outer.minY && inner.maxY <= outer.maxY
}

function cross(o: Point, a: Point, b: Point): number {
  return (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0])
}

/** True when every turn has the same sense (collinear vertices allowed). Rings here are simple already. */
export function isConvex(ring: Ring): boolean {
  let sign = 0
  for (let i = 0, n = ring.length; i < n; i++) {
    const c = cross(ring[i]!, ring[(i + 1) % n]!, ring[(i + 2) % n]!)
    if (c === 0) continue
    const s = c > 0 ? 1 : -1
    if (sign === 0) sign = s
    else if (s !== sign) return false
  }
  return true
}

export function distanceToSegment(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0]
  const dy = b[1] - a[1]
  const len2 = dx * dx + dy * dy
  let t = len2 === 0 ? 0 : ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2
  t = t < 0 ? 0 : t > 1 ? 1 : t
  return Math.hypot(p[0] - a[0] - t * dx, p[1] - a[1] - t * dy)
}

/** Distance from a point to a ring's outline. */
export function distanceToRing(p: Point, ring: Ring): number {
  let d = Infinity
  for (let i = 0, n = ring.length; i < n; i++) d = Math.min(d, distanceToSegment(p, ring[i]!, ring[(i + 1) % n]!))
  return d
}

/** A shape prepared once for many containment tests: the lot, or a ground planting's outline. */
export interface Shape { ring: Ring; box: Box; convex: boolean; area: number; sign: number }

export function shapeOf(ring: Ring): Shape {
  let signed = 0
  for (let i = 0, n = ring.length; i < n; i++) {
    const [x1, y1] = ring[i]!
    const [x2, y2] = ring[(i + 1) % n]!
    signed += x1 * y2 - x2 * y1
  }
  return { ring, box: boxOf(ring), convex: isConvex(ring), area: Math.abs(signed / 2), sign: signed >= 0 ? 1 : -1 }
}

// a point in the closed convex shape (on the outline counts); tolerance is relative to the edge length
function inConvexClosed(p: Point, s: Shape): boolean {
  const ring = s.ring
  for (let i = 0, n = ring.length; i < n; i++) {
    const a = ring[i]!
    const b = ring[(i + 1) % n]!
    const c = cross(a, b, p) * s.sign
    if (c < -1e-9 * (Math.abs(b[0] - a[0]) + Math.abs(b[1] - a[1]) + 1)) return false
  }
  return true
}

/** The closed disc lies wholly inside the shape: exact for any simple outline (centre inside, edges ≥ r away). */
export function circleInside(cx: number, cy: number, r: number, s: Shape): boolean {
  if (cx - r < s.box.minX || cx + r > s.box.maxX || cy - r < s.box.minY || cy + r > s.box.maxY) return false
  if (!pointInRing([cx, cy], s.ring)) return false
  return distanceToRing([cx, cy], s.ring) >= r
}

/** The disc and the shape share no interior. */
export function circleApart(cx: number, cy: number, r: number, s: Shape): boolean {
  if (cx + r <= s.box.minX || cx - r >= s.box.maxX || cy + r <= s.box.minY || cy - r >= s.box.maxY) return true
  return !pointInRing([cx, cy], s.ring) && distanceToRing([cx, cy], s.ring) >= r
}

function anyEdgesMeet(a: Ring, b: Ring, bBox: Box): boolean {
  for (let i = 0, n = a.length; i < n; i++) {
    const p = a[i]!
    const q = a[(i + 1) % n]!
    // skip edges outside the other's box: most pairs in a yard are far apart
    if (Math.max(p[0], q[0]) < bBox.minX || Math.min(p[0], q[0]) > bBox.maxX || Math.max(p[1], q[1]) < bBox.minY || Math.min(p[1], q[1]) > bBox.maxY) continue
    for (let j = 0, m = b.length; j < m; j++) if (segmentsIntersect(p, q, b[j]!, b[(j + 1) % m]!)) return true
  }
  return false
}

/**
 * The ring lies wholly inside the shape (touching its outline allowed). Exact when the shape is convex; for a
 * concave shape only the clear case (no edge meets the outline) is answered true, the rest goes to clipping.
 */
export function ringInside(ring: Ring, ringBox: Box, s: Shape): boolean {
  if (!boxInside(ringBox, s.box)) return false
  if (s.convex) return ring.every((p) => inConvexClosed(p, s))
  if (!pointInRing(ring[0]!, s.ring)) return false
  return !anyEdgesMeet(ring, s.ring, s.box)
}

/** The two rings share no interior, in the cases that are sure without clipping (else false). */
export function ringsApart(a: Ring, aBox: Box, b: Shape): boolean {
  if (!boxesOverlap(aBox, b.box)) return true
  if (anyEdgesMeet(a, b.ring, b.box)) return false
  // no edge meets: either one holds the other, or they are apart
  return !pointInRing(a[0]!, b.ring) && !pointInRing(b.ring[0]!, a)
}

export const clip = {
  intersection: (a: MultiPolygon | Polygon, ...b: Array<MultiPolygon | Polygon>) => polygonClipping.intersection(a as never, ...(b as never[])) as MultiPolygon,
  difference: (a: MultiPolygon | Polygon, ...b: Array<MultiPolygon | Polygon>) => polygonClipping.difference(a as never, ...(b as never[])) as MultiPolygon,
  union: (a: MultiPolygon | Polygon, ...b: Array<MultiPolygon | Polygon>) => polygonClipping.union(a as never, ...(b as never[])) as MultiPolygon,
}

/** Area of a circle clipped to the lot (null: no lot drawn, nothing is clipped). */
export function circleAreaInLot(cx: number, cy: number, r: number, lot: Shape | null): number {
  const full = Math.PI * r * r
  if (!lot || circleInside(cx, cy, r, lot)) return full
  if (circleApart(cx, cy, r, lot)) return 0
  return multiPolygonArea(clip.intersection([circleRing(cx, cy, r)], [lot.ring]))
}

/** The part of a ring inside the lot, as a multipolygon, and its area. */
export function ringInLot(ring: Ring, lot: Shape | null): { geom: MultiPolygon; area: number; whole: boolean } {
  const box = boxOf(ring)
  if (!lot || ringInside(ring, box, lot)) return { geom: [[ring]], area: ringArea(ring), whole: true }
  if (ringsApart(ring, box, lot)) return { geom: [], area: 0, whole: false }
  const geom = clip.intersection([ring], [lot.ring])
  return { geom, area: multiPolygonArea(geom), whole: false }
}

/**
 * Visible area of a ground-layer shape: its part inside the lot, less everything drawn above it (`above`).
 * Cutters wholly inside the shape and apart from each other are subtracted exactly; the rest is clipped.
 */
export interface Cutter { ring: Ring; box: Box }
export const cutterOf = (ring: Ring): Cutter => ({ ring, box: boxOf(ring) })

export function visibleArea(ring: Ring, lot: Shape | null, above: Cutter[]): { area: number; inLot: number } {
  const inLot = ringInLot(ring, lot)
  if (inLot.area === 0) return { area: 0, inLot: 0 }
  const box = boxOf(ring)
  const near = above.filter((c) => boxesOverlap(c.box, box))
  if (!near.length) return { area: inLot.area, inLot: inLot.area }
  const self = inLot.whole ? shapeOf(ring) : null
  // cutters that need clipping: they cross the outline, or they overlap another cutter
  const hard: Ring[] = []
  let subtract = 0
  const shapes = near.map((c) => shapeOf(c.ring))
  for (let i = 0; i < near.length; i++) {
    const c = near[i]!
    let overlapsOther = false
    for (let j = 0; j < near.length && !overlapsOther; j++) {
      if (j !== i && boxesOverlap(c.box, near[j]!.box) && !ringsApart(c.ring, c.box, shapes[j]!)) overlapsOther = true
    }
    if (!overlapsOther && self) {
      if (ringInside(c.ring, c.box, self)) { subtract += shapes[i]!.area; continue }
      if (ringsApart(c.ring, c.box, self)) continue
    }
    hard.push(c.ring)
  }
  if (hard.length) {
    const covered = clip.intersection(inLot.geom, clip.union(...hard.map((r) => [r] as Polygon)))
    subtract += multiPolygonArea(covered)
  }
  return { area: Math.max(0, inLot.area - subtract), inLot: inLot.area }
}

/** The visible part itself (for moves that redraw it): the ring inside the lot, less what is drawn above. */
export function visibleGeometry(ring: Ring, lot: Shape | null, above: Cutter[]): MultiPolygon {
  const inLot = ringInLot(ring, lot).geom
  if (!inLot.length) return []
  const box = boxOf(ring)
  const near = above.filter((c) => boxesOverlap(c.box, box))
  return near.length ? clip.difference(inLot, ...near.map((c) => [c.ring] as Polygon)) : inLot
}

/**
 * The point of the lot farthest from its outline, found on a grid (good to a grid step), with that clearance.
 * Used to place new plants where their whole footprint counts.
 */
export function roomiestPoint(lot: Shape | null, steps = 40): { point: Point; clearance: number } {
  if (!lot) return { point: [0, 0], clearance: Infinity }
  const { minX, minY, maxX, maxY } = lot.box
  let best: { point: Point; clearance: number } = { point: lot.ring[0]!, clearance: 0 }
  for (let i = 1; i < steps; i++) {
    for (let j = 1; j < steps; j++) {
      const p: Point = [minX + ((maxX - minX) * i) / steps, minY + ((maxY - minY) * j) / steps]
      if (!pointInRing(p, lot.ring)) continue
      const d = distanceToRing(p, lot.ring)
      if (d > best.clearance) best = { point: p, clearance: d }
    }
  }
  return best
}
