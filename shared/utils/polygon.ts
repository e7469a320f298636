// Pure polygon helpers used by validation and scoring. Points are [x, y] in metres, y down.
export type Point = [number, number]
export type Ring = Point[]

/** Signed area by the shoelace formula (positive when the ring runs clockwise on screen, i.e. y down). */
export function signedArea(ring: Ring): number {
  let sum = 0
  for (let i = 0, n = ring.length; i < n; i++) {
    const [x1, y1] = ring[i]!
    const [x2, y2] = ring[(i + 1) % n]!
    sum += x1 * y2 - x2 * y1
  }
  return sum / 2
}

export function ringArea(ring: Ring): number {
  return Math.abs(signedArea(ring))
}

function orient(a: Point, b: Point, c: Point): number {
  return (b[0] - a[0]) * (c[1] - a[1]) - (b[1] - a[1]) * (c[0] - a[0])
}

function onSegment(a: Point, b: Point, p: Point): boolean {
  return Math.min(a[0], b[0]) <= p[0] && p[0] <= Math.max(a[0], b[0]) && Math.min(a[1], b[1]) <= p[1] && p[1] <= Math.max(a[1], b[1])
}

export function segmentsIntersect(a: Point, b: Point, c: Point, d: Point): boolean {
  const o1 = orient(a, b, c)
  const o2 = orient(a, b, d)
  const o3 = orient(c, d, a)
  const o4 = orient(c, d, b)
  if (((o1 > 0 && o2 < 0) || (o1 < 0 && o2 > 0)) && ((o3 > 0 && o4 < 0) || (o3 < 0 && o4 > 0))) return true
  if (o1 === 0 && onSegment(a, b, c)) return true
  if (o2 === 0 && onSegment(a, b, d)) return true
  if (o3 === 0 && onSegment(c, d, a)) return true
  if (o4 === 0 && onSegment(c, d, b)) return true
  return false
}

/**
 * Index of the first edge that crosses or touches a non-adjacent edge, or -1 when the ring is simple.
 * Zero-area rings count as not simple. O(n²), fine for hand-drawn outlines (tens of vertices).
 */
export function firstSelfIntersection(ring: Ring): number {
  const n = ring.length
  if (n < 3) return 0
  if (ringArea(ring) === 0) return 0
  for (let i = 0; i < n; i++) {
    const a = ring[i]!
    const b = ring[(i + 1) % n]!
    if (a[0] === b[0] && a[1] === b[1]) return i
    for (let j = i + 1; j < n; j++) {
      // adjacent edges share a vertex by construction
      if (j === i || (j + 1) % n === i || (i + 1) % n === j) continue
      if (segmentsIntersect(a, b, ring[j]!, ring[(j + 1) % n]!)) return i
    }
  }
  return -1
}

export function centroid(ring: Ring): Point {
  const a = signedArea(ring)
  if (a === 0) {
    const sx = ring.reduce((s, p) => s + p[0], 0)
    const sy = ring.reduce((s, p) => s + p[1], 0)
    return [sx / ring.length, sy / ring.length]
  }
  let cx = 0
  let cy = 0
  for (let i = 0, n = ring.length; i < n; i++) {
    const [x1, y1] = ring[i]!
    const [x2, y2] = ring[(i + 1) % n]!
    const f = x1 * y2 - x2 * y1
    cx += (x1 + x2) * f
    cy += (y1 + y2) * f
  }
  return [cx / (6 * a), cy / (6 * a)]
}

export function pointInRing(p: Point, ring: Ring): boolean {
  let inside = false
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!
    const [xj, yj] = ring[j]!
    if ((yi > p[1]) !== (yj > p[1]) && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside
  }
  return inside
}
