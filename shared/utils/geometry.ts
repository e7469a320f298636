// Footprint geometry for the score: circles in the lot (exact), clipping outlines to the lot, cutting the ground layer by
// what is drawn above it. Exact analytic answers first (a shape wholly inside or wholly apart); polygon-clipping
// only where shapes really cross. Points are [x, y] in metres, y down.
import polygonClipping from 'polygon-clipping'
import { ringArea, pointInRing, segmentsIntersect, type Point, type Ring } from './polygon'
import { clipConvex, convexPartition } from './convex-pieces'

export type Polygon = Ring[]
export type MultiPolygon = Polygon[]
export interface Box { minX: number; minY: number; maxX: number; maxY: number }

/** A circle as an n-sided polygon of the same area (for tests and drawings; the score measures circles exactly). */
export function circleRing(cx: number, cy: number, r: number, sides = 96): Ring {
  // the vertices sit a little outside the circle so that the polygon's area equals πr²
  const scale = Math.sqrt((2 * Math.PI / sides) / Math.sin(2 * Math.PI / sides))
  return Array.from({ length: sides }, (_, i): Point => {
    const a = (2 * Math.PI * i) / sides
    return [cx + Math.cos(a) * scale * r, cy + Math.sin(a) * scale * r]
  })
}

// signed area of the disc of radius r about the origin inside the triangle (origin, a, b): the sector pieces
// where the edge a→b runs outside the circle, the triangle piece where it runs inside
function discInTriangle(ax: number, ay: number, bx: number, by: number, r: number): number {
  const sector = (ux: number, uy: number, vx: number, vy: number) => (r * r / 2) * Math.atan2(ux * vy - uy * vx, ux * vx + uy * vy)
  const dx = bx - ax
  const dy = by - ay
  const A = dx * dx + dy * dy
  if (A === 0) return 0
  const B = ax * dx + ay * dy
  const C = ax * ax + ay * ay - r * r
  const disc = B * B - A * C
  if (disc <= 0) return sector(ax, ay, bx, by)
  const s = Math.sqrt(disc)
  const t1 = Math.max(0, (-B - s) / A)
  const t2 = Math.min(1, (-B + s) / A)
  if (t1 >= t2) return sector(ax, ay, bx, by)
  const p1x = ax + t1 * dx, p1y = ay + t1 * dy, p2x = ax + t2 * dx, p2y = ay + t2 * dy
  return sector(ax, ay, p1x, p1y) + (p1x * p2y - p1y * p2x) / 2 + sector(p2x, p2y, bx, by)
}

/** Exact area of a disc inside a simple polygon: the signed sum over its edges of disc ∩ triangle(centre, edge). */
export function circleRingArea(cx: number, cy: number, r: number, ring: Ring): number {
  let sum = 0
  for (let i = 0, n = ring.length; i < n; i++) {
    const a = ring[i]!
    const b = ring[(i + 1) % n]!
    sum += discInTriangle(a[0] - cx, a[1] - cy, b[0] - cx, b[1] - cy, r)
  }
  return Math.min(Math.PI * r * r, Math.abs(sum))
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
/** `rect`: an axis-aligned rectangle, for which the box says everything. */
export interface Shape {
  ring: Ring; box: Box; convex: boolean; rect: boolean; area: number; sign: number
  /** convex pieces, worked out on first use (see `convexPieces`) */
  pieces?: Shape[] | null
  /** the edges binned in a grid, built on first use for outlines of many points (see `edgeGrid`) */
  grid?: EdgeGrid | null
}

/** A shape's edges binned in a uniform grid: a point or disc query looks at the edges near it only. */
interface EdgeGrid { minX: number; minY: number; cw: number; ch: number; cols: number; rows: number; cells: number[][]; seen: Int32Array; stamp: number }

// below this many points a plain walk over the edges is as quick as the grid
const GRID_MIN_POINTS = 48

function edgeGrid(s: Shape): EdgeGrid | null {
  if (s.grid !== undefined) return s.grid
  const n = s.ring.length
  if (n < GRID_MIN_POINTS || s.box.maxX <= s.box.minX || s.box.maxY <= s.box.minY) return (s.grid = null)
  const side = Math.ceil(Math.sqrt(n))
  const { minX, minY } = s.box
  const cw = (s.box.maxX - minX) / side
  const ch = (s.box.maxY - minY) / side
  const cells: number[][] = Array.from({ length: side * side }, () => [])
  const col = (x: number) => Math.min(side - 1, Math.max(0, Math.floor((x - minX) / cw)))
  const row = (y: number) => Math.min(side - 1, Math.max(0, Math.floor((y - minY) / ch)))
  for (let i = 0; i < n; i++) {
    const a = s.ring[i]!
    const b = s.ring[(i + 1) % n]!
    for (let r = row(Math.min(a[1], b[1])), r1 = row(Math.max(a[1], b[1])); r <= r1; r++) {
      for (let c = col(Math.min(a[0], b[0])), c1 = col(Math.max(a[0], b[0])); c <= c1; c++) cells[r * side + c]!.push(i)
    }
  }
  return (s.grid = { minX, minY, cw, ch, cols: side, rows: side, cells, seen: new Int32Array(n), stamp: 0 })
}

// each edge of the cells in [c0, c1] × [r0, r1] once (an edge can lie in several cells)
function forEdgesIn(g: EdgeGrid, c0: number, c1: number, r0: number, r1: number, visit: (i: number) => boolean | void): boolean {
  const stamp = ++g.stamp
  for (let r = Math.max(0, r0); r <= Math.min(g.rows - 1, r1); r++) {
    for (let c = Math.max(0, c0); c <= Math.min(g.cols - 1, c1); c++) {
      for (const i of g.cells[r * g.cols + c]!) {
        if (g.seen[i] === stamp) continue
        g.seen[i] = stamp
        if (visit(i)) return true
      }
    }
  }
  return false
}

/** `pointInRing` on a prepared shape: only the edges in the point's grid row, right of it, can cross its ray. */
export function pointInShape(p: Point, s: Shape): boolean {
  const g = edgeGrid(s)
  if (!g) return pointInRing(p, s.ring)
  if (p[1] < s.box.minY || p[1] > s.box.maxY || p[0] > s.box.maxX) return false
  const ring = s.ring
  const n = ring.length
  const r = Math.min(g.rows - 1, Math.floor((p[1] - g.minY) / g.ch))
  const c = Math.max(0, Math.min(g.cols - 1, Math.floor((p[0] - g.minX) / g.cw)))
  let inside = false
  forEdgesIn(g, c, g.cols - 1, r, r, (i) => {
    const [xi, yi] = ring[(i + 1) % n]!
    const [xj, yj] = ring[i]!
    if ((yi > p[1]) !== (yj > p[1]) && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside
  })
  return inside
}

/** Some edge of the shape comes closer than `r` to the point (only edges in grid cells within reach are looked at). */
function edgeWithin(p: Point, r: number, s: Shape): boolean {
  const g = edgeGrid(s)
  if (!g) return distanceToRing(p, s.ring) < r
  const ring = s.ring
  const n = ring.length
  const col = (x: number) => Math.floor((x - g.minX) / g.cw)
  const row = (y: number) => Math.floor((y - g.minY) / g.ch)
  return forEdgesIn(g, col(p[0] - r), col(p[0] + r), row(p[1] - r), row(p[1] + r), (i) => distanceToSegment(p, ring[i]!, ring[(i + 1) % n]!) < r)
}

function isBoxRing(ring: Ring, box: Box): boolean {
  if (ring.length !== 4) return false
  for (let i = 0; i < 4; i++) {
    const [x1, y1] = ring[i]!
    const [x2, y2] = ring[(i + 1) % 4]!
    if (x1 !== x2 && y1 !== y2) return false
    if ((x1 !== box.minX && x1 !== box.maxX) || (y1 !== box.minY && y1 !== box.maxY)) return false
  }
  return box.maxX > box.minX && box.maxY > box.minY
}

export function shapeOf(ring: Ring): Shape {
  let signed = 0
  for (let i = 0, n = ring.length; i < n; i++) {
    const [x1, y1] = ring[i]!
    const [x2, y2] = ring[(i + 1) % n]!
    signed += x1 * y2 - x2 * y1
  }
  const box = boxOf(ring)
  // four corners of the box joined by axis-parallel edges, covering the whole box (so not folded back)
  const rect = isBoxRing(ring, box) && Math.abs(signed / 2) === (box.maxX - box.minX) * (box.maxY - box.minY)
  return { ring, box, convex: rect || isConvex(ring), rect, area: Math.abs(signed / 2), sign: signed >= 0 ? 1 : -1 }
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
  if (s.rect) return true
  if (!pointInShape([cx, cy], s)) return false
  return !edgeWithin([cx, cy], r, s)
}

/** The disc and the shape share no interior. */
export function circleApart(cx: number, cy: number, r: number, s: Shape): boolean {
  if (cx + r <= s.box.minX || cx - r >= s.box.maxX || cy + r <= s.box.minY || cy - r >= s.box.maxY) return true
  return !pointInShape([cx, cy], s) && !edgeWithin([cx, cy], r, s)
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
  if (s.rect) return true
  if (s.convex) return ring.every((p) => inConvexClosed(p, s))
  if (!pointInRing(ring[0]!, s.ring)) return false
  return !anyEdgesMeet(ring, s.ring, s.box)
}

// convex outlines share no interior when some edge normal separates their projections (touching allowed)
function separatedConvex(a: Shape, b: Shape): boolean {
  for (const s of [a, b]) {
    const ring = s.ring
    for (let i = 0, n = ring.length; i < n; i++) {
      const p = ring[i]!
      const q = ring[(i + 1) % n]!
      const nx = q[1] - p[1]
      const ny = p[0] - q[0]
      if (nx === 0 && ny === 0) continue
      let minA = Infinity, maxA = -Infinity, minB = Infinity, maxB = -Infinity
      for (const [x, y] of a.ring) { const d = x * nx + y * ny; if (d < minA) minA = d; if (d > maxA) maxA = d }
      for (const [x, y] of b.ring) { const d = x * nx + y * ny; if (d < minB) minB = d; if (d > maxB) maxB = d }
      const tol = 1e-12 * (Math.abs(minA) + Math.abs(maxA) + Math.abs(minB) + Math.abs(maxB) + 1)
      if (maxA <= minB + tol || maxB <= minA + tol) return true
    }
  }
  return false
}

/** The two outlines share no interior, in the cases that are sure without clipping (else false). */
export function ringsApart(a: Shape, b: Shape): boolean {
  if (!boxesOverlap(a.box, b.box)) return true
  if (a.rect && b.rect) return false
  if (a.convex && b.convex) return separatedConvex(a, b)
  if (anyEdgesMeet(a.ring, b.ring, b.box)) return false
  // no edge meets: either one holds the other, or they are apart
  return !pointInRing(a.ring[0]!, b.ring) && !pointInRing(b.ring[0]!, a.ring)
}

type Geom = MultiPolygon | Polygon
const snap = (g: Geom): Geom => JSON.parse(JSON.stringify(g), (_, v) => (typeof v === 'number' ? Math.round(v * 1e6) / 1e6 : v))

// polygon-clipping now and then fails on nearly degenerate input ("Unable to complete output ring"): retry once
// on a 1 µm grid, which moves nothing that matters for a yard
function robust(op: (a: Geom, ...b: Geom[]) => MultiPolygon): (a: Geom, ...b: Geom[]) => MultiPolygon {
  return (a, ...b) => {
    try {
      return op(a, ...b)
    } catch {
      return op(snap(a), ...b.map(snap))
    }
  }
}

export const clip = {
  intersection: robust((a, ...b) => polygonClipping.intersection(a as never, ...(b as never[])) as MultiPolygon),
  difference: robust((a, ...b) => polygonClipping.difference(a as never, ...(b as never[])) as MultiPolygon),
  union: robust((a, ...b) => polygonClipping.union(a as never, ...(b as never[])) as MultiPolygon),
}

/** Area of a circle clipped to the lot (null: no lot drawn, nothing is clipped). */
export function circleAreaInLot(cx: number, cy: number, r: number, lot: Shape | null): number {
  const full = Math.PI * r * r
  if (!lot || circleInside(cx, cy, r, lot)) return full
  if (circleApart(cx, cy, r, lot)) return 0
  return circleRingArea(cx, cy, r, lot.ring)
}

/** The part of a ring inside the lot, as a multipolygon, and its area. */
export function ringInLot(ring: Ring, lot: Shape | null, prepared?: Shape): { geom: MultiPolygon; area: number; whole: boolean } {
  const box = prepared?.box ?? boxOf(ring)
  if (!lot || ringInside(ring, box, lot)) return { geom: [[ring]], area: prepared?.area ?? ringArea(ring), whole: true }
  if (ringsApart(prepared ?? shapeOf(ring), lot)) return { geom: [], area: 0, whole: false }
  const geom = clip.intersection([ring], [lot.ring])
  return { geom, area: multiPolygonArea(geom), whole: false }
}

/**
 * Exact area of a union of convex outlines, without clipping: by Green's theorem the area is the sum of
 * ½(x₁y₂ − x₂y₁) over the pieces of every edge that lie outside all the other outlines. Edges that coincide in
 * the same direction count once; opposite ones cancel by themselves.
 */
export function convexUnionArea(shapes: Shape[]): number {
  if (shapes.length === 1) return shapes[0]!.area
  let sum = 0
  const cut: Array<[number, number]> = []
  for (let a = 0; a < shapes.length; a++) {
    const A = shapes[a]!
    const ring = A.ring
    for (let i = 0, n = ring.length; i < n; i++) {
      const p = ring[i]!
      const q = ring[(i + 1) % n]!
      if (p[0] === q[0] && p[1] === q[1]) continue
      const ex = q[0] - p[0]
      const ey = q[1] - p[1]
      // boxes widened by the collinearity tolerance, so an edge a hair outside another still meets it
      const m = 1e-9 * (Math.abs(p[0]) + Math.abs(p[1]) + Math.abs(ex) + Math.abs(ey) + 1)
      const eMinX = Math.min(p[0], q[0]) - m, eMaxX = Math.max(p[0], q[0]) + m, eMinY = Math.min(p[1], q[1]) - m, eMaxY = Math.max(p[1], q[1]) + m
      cut.length = 0
      for (let b = 0; b < shapes.length; b++) {
        if (b === a) continue
        const B = shapes[b]!
        if (eMaxX < B.box.minX || eMinX > B.box.maxX || eMaxY < B.box.minY || eMinY > B.box.maxY) continue
        const span = edgeInConvex(p, q, ex, ey, B)
        if (!span) continue
        // on B's outline: drop the piece once for edges running the same way, keep it when they run opposite
        if (span[2] === 0 || (span[2] * A.sign * B.sign > 0 && b < a)) cut.push([span[0], span[1]])
      }
      let t = 0
      cut.sort((u, v) => u[0] - v[0])
      for (const [lo, hi] of cut) {
        if (lo > t) sum += A.sign * piece(p, ex, ey, t, lo)
        if (hi > t) t = hi
      }
      if (t < 1) sum += A.sign * piece(p, ex, ey, t, 1)
    }
  }
  return Math.abs(sum / 2)
}

function piece(p: Point, ex: number, ey: number, t0: number, t1: number): number {
  const x1 = p[0] + ex * t0, y1 = p[1] + ey * t0, x2 = p[0] + ex * t1, y2 = p[1] + ey * t1
  return x1 * y2 - x2 * y1
}

// The part [t0, t1] of edge p→q inside the closed convex outline B, and whether it runs along B's outline:
// 0 inside, 1 along an edge of B in the same sense (after orientation), −1 along it in the opposite sense.
function edgeInConvex(p: Point, q: Point, ex: number, ey: number, B: Shape): [number, number, number] | null {
  let lo = 0
  let hi = 1
  let along = 0
  const ring = B.ring
  const tol = 1e-9 * (Math.abs(p[0]) + Math.abs(p[1]) + Math.abs(ex) + Math.abs(ey) + 1)
  for (let k = 0, m = ring.length; k < m; k++) {
    const b0 = ring[k]!
    const b1 = ring[(k + 1) % m]!
    const bx = b1[0] - b0[0]
    const by = b1[1] - b0[1]
    const len = Math.hypot(bx, by)
    if (len === 0) continue
    // signed distances of p and q from B's edge line, positive inside B
    const d0 = (B.sign * (bx * (p[1] - b0[1]) - by * (p[0] - b0[0]))) / len
    const d1 = (B.sign * (bx * (q[1] - b0[1]) - by * (q[0] - b0[0]))) / len
    if (Math.abs(d0) <= tol && Math.abs(d1) <= tol) {
      along = ex * bx + ey * by > 0 ? 1 : -1
      continue
    }
    if (d0 < 0 && d1 < 0) return null
    if (d0 < 0) lo = Math.max(lo, d0 / (d0 - d1))
    else if (d1 < 0) hi = Math.min(hi, d0 / (d0 - d1))
  }
  return hi - lo > 1e-12 ? [lo, hi, along] : null
}

/** A shape drawn above a ground planting, prepared once per document. */
export type Cutter = Shape
export const cutterOf = shapeOf

/** The shape as convex pieces with disjoint interiors (itself when convex); null when it cannot be cut. */
export function convexPieces(s: Shape): Shape[] | null {
  if (s.pieces === undefined) {
    const parts = s.convex ? null : convexPartition(s.ring)
    s.pieces = s.convex ? [s] : parts ? parts.map(shapeOf) : null
  }
  return s.pieces
}

/** Convex pieces of the shape's part inside the lot; null when either cannot be cut into convex pieces. */
export function piecesInLot(s: Shape, lot: Shape | null): Shape[] | null {
  const own = convexPieces(s)
  if (!own || !lot || ringInside(s.ring, s.box, lot)) return own
  if (ringsApart(s, lot)) return []
  const lotPieces = convexPieces(lot)
  if (!lotPieces) return null
  const out: Shape[] = []
  for (const p of own) {
    for (const l of lotPieces) {
      if (!boxesOverlap(p.box, l.box)) continue
      const part = clipConvex(p.ring, l.ring)
      if (part) out.push(shapeOf(part))
    }
  }
  return out
}

/** Area of an outline inside the lot. */
export function areaInLot(s: Shape, lot: Shape | null): number {
  const pieces = piecesInLot(s, lot)
  return pieces ? pieces.reduce((sum, p) => sum + p.area, 0) : ringInLot(s.ring, lot, s).area
}

// clipping leaves points a rounding error apart; an edge that short has no trustworthy direction
function withoutNearRepeats(ring: Ring, eps: number): Ring | null {
  const out: Ring = []
  for (const p of ring) {
    const last = out[out.length - 1]
    if (!last || Math.abs(p[0] - last[0]) + Math.abs(p[1] - last[1]) > eps) out.push(p)
  }
  while (out.length > 1 && Math.abs(out[0]![0] - out[out.length - 1]![0]) + Math.abs(out[0]![1] - out[out.length - 1]![1]) <= eps) out.pop()
  return out.length >= 3 ? out : null
}

// a clipped piece smaller than this share of the piece it was clipped to is dropped
const SLIVER = 1e-9

/**
 * Visible area of a ground-layer shape: its part inside the lot, less everything drawn above it (`above`).
 * Every outline is cut into convex pieces, so each covered part is |P ∩ U| = |P| + |U| − |P ∪ U| for a convex
 * piece P of the shape and the union U of the cutters' pieces near it, all unions of convex outlines (exact).
 * Groups of cutters that overlap nothing else are handled apart; a cutter inside another counts once.
 */
export function visibleArea(ring: Ring, lot: Shape | null, above: Cutter[], prepared?: Shape): { area: number; inLot: number } {
  const self = prepared ?? shapeOf(ring)
  const pieces = piecesInLot(self, lot)
  if (!pieces) return visibleAreaByClipping(ring, lot, above, self)
  let inLot = 0
  for (const p of pieces) inLot += p.area
  if (inLot === 0) return { area: 0, inLot: 0 }
  const near = above.filter((c) => boxesOverlap(c.box, self.box) && !ringsApart(c, self))
  if (!near.length) return { area: inLot, inLot }
  const whole = pieces.length === 1 && pieces[0] === self
  let subtract = 0
  for (const group of overlapGroups(near).values()) {
    const kept = keptOf(group)
    if (kept.length === 1 && whole && ringInside(kept[0]!.ring, kept[0]!.box, self)) { subtract += kept[0]!.area; continue }
    const cut: Shape[] = []
    for (const c of kept) {
      const cp = convexPieces(c)
      if (!cp) return visibleAreaByClipping(ring, lot, above, self)
      for (const x of cp) cut.push(x)
    }
    for (const p of pieces) {
      // |P ∩ U| is the area of the union of each cutter piece clipped to P (convex by convex, small)
      const inP: Shape[] = []
      for (const c of cut) {
        if (!boxesOverlap(c.box, p.box)) continue
        const part = c.ring.length <= p.ring.length ? clipConvex(p.ring, c.ring) : clipConvex(c.ring, p.ring)
        const ring = part && withoutNearRepeats(part, 1e-9 * (p.box.maxX - p.box.minX + p.box.maxY - p.box.minY))
        const q = ring && shapeOf(ring)
        // a sliver adds at most its own (negligible) area and its orientation is not to be trusted
        if (q && q.area > SLIVER * p.area) inP.push(q)
      }
      if (inP.length) subtract += convexUnionArea(inP)
    }
  }
  return { area: Math.max(0, inLot - subtract), inLot }
}

// the cutters in groups that overlap each other: union-find over pairs, swept in x so far-apart pairs are skipped
function overlapGroups(near: Cutter[]): Map<number, Cutter[]> {
  near.sort((a, b) => a.box.minX - b.box.minX)
  const parent = near.map((_, i) => i)
  const find = (i: number): number => (parent[i] === i ? i : (parent[i] = find(parent[i]!)))
  for (let i = 0; i < near.length; i++) {
    const a = near[i]!
    for (let j = i + 1; j < near.length && near[j]!.box.minX < a.box.maxX; j++) {
      if (boxesOverlap(a.box, near[j]!.box) && !ringsApart(a, near[j]!)) parent[find(i)] = find(j)
    }
  }
  const groups = new Map<number, Cutter[]>()
  near.forEach((c, i) => {
    const r = find(i)
    const g = groups.get(r)
    if (g) g.push(c)
    else groups.set(r, [c])
  })
  return groups
}

// a cutter inside another of its group adds nothing to the group's cover (a drift in its bed)
const keptOf = (group: Cutter[]) => group.filter((c, i) => !group.some((o, j) => j !== i && o.convex && ringInside(c.ring, c.box, o) && !(j > i && ringInside(o.ring, o.box, c))))

// the visible area through polygon-clipping: for outlines that cannot be cut into convex pieces
function visibleAreaByClipping(ring: Ring, lot: Shape | null, above: Cutter[], prepared?: Shape): { area: number; inLot: number } {
  const self = prepared ?? shapeOf(ring)
  const inLot = ringInLot(ring, lot, self)
  if (inLot.area === 0) return { area: 0, inLot: 0 }
  const near = above.filter((c) => boxesOverlap(c.box, self.box) && !ringsApart(c, self))
  if (!near.length) return { area: inLot.area, inLot: inLot.area }
  const groups = overlapGroups(near)
  const hard: Cutter[][] = []
  let subtract = 0
  for (const group of groups.values()) {
    const kept = keptOf(group)
    if (kept.length === 1 && inLot.whole && ringInside(kept[0]!.ring, kept[0]!.box, self)) subtract += kept[0]!.area
    // convex pieces on a convex shape: |S ∩ U| = |S| + |U| − |S ∪ U|, all unions of convex outlines
    else if (inLot.whole && self.convex && kept.every((c) => c.convex)) subtract += self.area + convexUnionArea(kept) - convexUnionArea([self, ...kept])
    else hard.push(kept)
  }
  // groups share no interior, so each is clipped on its own: the clipper's cost grows faster than its input
  for (const kept of hard) {
    const [first, ...rest] = kept.map((c) => [c.ring] as Polygon)
    const union = rest.length ? clip.union(first!, ...rest) : [first!]
    const inside = inLot.whole && kept.every((c) => ringInside(c.ring, c.box, self))
    subtract += multiPolygonArea(inside ? union : clip.intersection(inLot.geom, union))
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
      if (!pointInShape(p, lot)) continue
      const d = distanceToRing(p, lot.ring)
      if (d > best.clearance) best = { point: p, clearance: d }
    }
  }
  return best
}
