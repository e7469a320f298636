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
 * Index of the first edge that crosses or touches a non-adjacent edge (the lowest index among such pairs, or a
 * zero-length edge), or -1 when the ring is simple. Zero-area rings count as not simple. Edges are binned in a
 * uniform grid of about one cell per edge and only edges sharing a cell are compared, so an outline costs about
 * O(n √n) rather than O(n²).
 */
export function firstSelfIntersection(ring: Ring): number {
  const n = ring.length
  if (n < 3) return 0
  if (ringArea(ring) === 0) return 0
  if (n <= SMALL_RING) return allPairsSelfIntersection(ring)
  let minX = Infinity, minY = Infinity, maxX = -Infinity, maxY = -Infinity
  for (let i = 0; i < n; i++) {
    const [x, y] = ring[i]!
    if (x < minX) minX = x
    if (x > maxX) maxX = x
    if (y < minY) minY = y
    if (y > maxY) maxY = y
  }
  const side = Math.max(1, Math.ceil(Math.sqrt(n)))
  const w = (maxX - minX) / side || 1
  const h = (maxY - minY) / side || 1
  // a little slack so that a crossing on a cell border is in a cell of both edges despite rounding
  const eps = 1e-9 * Math.max(1, Math.abs(maxX - minX) + Math.abs(maxY - minY) + Math.abs(minX) + Math.abs(minY))
  const col = (x: number) => Math.min(side - 1, Math.max(0, Math.floor((x - minX) / w)))
  const row = (y: number) => Math.min(side - 1, Math.max(0, Math.floor((y - minY) / h)))
  const cells: number[][] = Array.from({ length: side * side }, () => [])
  for (let i = 0; i < n; i++) {
    const [ax, ay] = ring[i]!
    const [bx, by] = ring[(i + 1) % n]!
    const x0 = Math.min(ax, bx), x1 = Math.max(ax, bx)
    for (let c = col(x0 - eps), cEnd = col(x1 + eps); c <= cEnd; c++) {
      // the part of the edge inside this column strip, and the rows it spans there
      const lo = Math.max(x0, minX + c * w), hi = Math.min(x1, minX + (c + 1) * w)
      let ylo: number, yhi: number
      if (ax === bx) { ylo = Math.min(ay, by); yhi = Math.max(ay, by) } else {
        const ya = ay + ((lo - ax) / (bx - ax)) * (by - ay)
        const yb = ay + ((hi - ax) / (bx - ax)) * (by - ay)
        ylo = Math.max(Math.min(ya, yb), Math.min(ay, by)); yhi = Math.min(Math.max(ya, yb), Math.max(ay, by))
      }
      for (let r = row(ylo - eps), rEnd = row(yhi + eps); r <= rEnd; r++) cells[r * side + c]!.push(i)
    }
  }
  const zero = firstZeroEdge(ring)
  let best = zero >= 0 ? zero : n
  const tested = new Set<number>()
  for (const edges of cells) {
    for (let p = 0; p < edges.length; p++) {
      for (let q = p + 1; q < edges.length; q++) {
        const i = Math.min(edges[p]!, edges[q]!), j = Math.max(edges[p]!, edges[q]!)
        // adjacent edges share a vertex by construction; a pair that cannot lower the answer is not worth testing
        if (i >= best || j === i + 1 || (i === 0 && j === n - 1)) continue
        const key = i * n + j
        if (tested.has(key)) continue
        tested.add(key)
        if (segmentsIntersect(ring[i]!, ring[i + 1]!, ring[j]!, ring[(j + 1) % n]!)) best = i
      }
    }
  }
  return best < n ? best : -1
}

// below this many vertices comparing every pair is cheaper than building a grid
const SMALL_RING = 48

function allPairsSelfIntersection(ring: Ring): number {
  const n = ring.length
  for (let i = 0; i < n; i++) {
    const a = ring[i]!
    const b = ring[(i + 1) % n]!
    if (a[0] === b[0] && a[1] === b[1]) return i
    for (let j = i + 2; j < n; j++) {
      // adjacent edges share a vertex by construction
      if (i === 0 && j === n - 1) continue
      if (segmentsIntersect(a, b, ring[j]!, ring[(j + 1) % n]!)) return i
    }
  }
  return -1
}

function firstZeroEdge(ring: Ring): number {
  const n = ring.length
  for (let i = 0; i < n; i++) {
    const a = ring[i]!, b = ring[(i + 1) % n]!
    if (a[0] === b[0] && a[1] === b[1]) return i
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
