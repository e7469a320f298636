// Outlines as convex pieces, so that every area the score needs is a union of convex outlines, measured exactly
// by `convexUnionArea` (Green's theorem) instead of a general polygon clipper: a concave outline is cut into
// triangles (ear clipping), and a piece crossing the lot is clipped to it (Sutherland–Hodgman, convex by convex).
import { signedArea, type Point, type Ring } from './polygon'

const cross = (o: Point, a: Point, b: Point) => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0])

/**
 * A simple outline as triangles (ear clipping, O(n²): outlines here have tens of vertices); null when the
 * outline defeats it (a vertex repeated, an outline touching itself), for the caller to measure another way.
 */
export function triangulate(ring: Ring): Ring[] | null {
  const tris = triangleIndices(ring)
  return tris && tris.map((t) => t.map((i) => ring[i]!))
}

// ear clipping as triangles of vertex indices (in the outline's own sense), checked to tile the outline
function triangleIndices(ring: Ring): number[][] | null {
  const total = Math.abs(signedArea(ring))
  if (total === 0) return []
  const sign = signedArea(ring) > 0 ? 1 : -1
  const idx = ring.map((_, i) => i)
  const out: number[][] = []
  while (idx.length > 3) {
    let found = false
    for (let k = 0; k < idx.length; k++) {
      const ia = idx[(k + idx.length - 1) % idx.length]!, ib = idx[k]!, ic = idx[(k + 1) % idx.length]!
      const a = ring[ia]!, b = ring[ib]!, c = ring[ic]!
      const turn = cross(a, b, c) * sign
      // a vertex on the straight line between its neighbours adds nothing
      if (turn === 0) { idx.splice(k, 1); found = true; break }
      if (turn < 0) continue
      let ear = true
      for (const j of idx) {
        if (j === ia || j === ib || j === ic) continue
        const p = ring[j]!
        if (cross(a, b, p) * sign >= 0 && cross(b, c, p) * sign >= 0 && cross(c, a, p) * sign >= 0) { ear = false; break }
      }
      if (!ear) continue
      out.push([ia, ib, ic])
      idx.splice(k, 1)
      found = true
      break
    }
    if (!found) return null
  }
  if (idx.length === 3) out.push(idx.slice())
  // the triangles must tile the outline exactly (else it was not simple)
  const areaOf = (t: number[]) => signedArea(t.map((i) => ring[i]!))
  const sum = out.reduce((s, t) => s + Math.abs(areaOf(t)), 0)
  return Math.abs(sum - total) <= 1e-9 * Math.max(1, total) ? out.filter((t) => areaOf(t) !== 0) : null
}

/**
 * A simple outline as few convex pieces: its triangles, merged across each inner edge whose removal leaves the
 * union convex (Hertel–Mehlhorn; at most four times the fewest pieces possible). A star-like drift becomes its
 * convex core and one small piece per point, not hundreds of long slivers that all overlap each other.
 */
export function convexPartition(ring: Ring): Ring[] | null {
  const tris = triangleIndices(ring)
  if (!tris) return null
  const sign = signedArea(ring) > 0 ? 1 : -1
  const pieces: Array<number[] | null> = tris.map((t) => t.slice())
  const owner = pieces.map((_, i) => i)
  const find = (i: number): number => (owner[i] === i ? i : (owner[i] = find(owner[i]!)))
  // each inner edge (diagonal) once, with the two triangles either side
  const firstSide = new Map<string, number>()
  const diagonals: Array<[number, number, number, number]> = []
  tris.forEach((t, k) => {
    for (let e = 0; e < 3; e++) {
      const u = t[e]!, v = t[(e + 1) % 3]!
      const key = u < v ? `${u},${v}` : `${v},${u}`
      const other = firstSide.get(key)
      if (other === undefined) firstSide.set(key, k)
      else diagonals.push([u, v, other, k])
    }
  })
  const turn = (a: number, b: number, c: number) => cross(ring[a]!, ring[b]!, ring[c]!) * sign
  for (const [u0, v0, p, q] of diagonals) {
    const ia = find(p), ib = find(q)
    const A = pieces[ia]!, B = pieces[ib]!
    // orient the diagonal as A runs along it: u → v in A, so v → u in B
    let i = A.findIndex((x, k) => x === u0 && A[(k + 1) % A.length] === v0)
    const [u, v] = i >= 0 ? [u0, v0] : [v0, u0]
    if (i < 0) i = A.findIndex((x, k) => x === u && A[(k + 1) % A.length] === v)
    const j = B.findIndex((x, k) => x === v && B[(k + 1) % B.length] === u)
    if (i < 0 || j < 0) continue
    const a = A.length, b = B.length
    // the merged piece: A from v round to u, then B's vertices strictly between u and v
    const merged: number[] = []
    for (let k = 1; k <= a; k++) merged.push(A[(i + k) % a]!)
    for (let k = 2; k < b; k++) merged.push(B[(j + k) % b]!)
    const beforeU = A[(i + a - 1) % a]!, afterU = B[(j + 2) % b]!
    const beforeV = B[(j + b - 1) % b]!, afterV = A[(i + 2) % a]!
    if (turn(beforeU, u, afterU) < 0 || turn(beforeV, v, afterV) < 0) continue
    pieces[ia] = merged
    pieces[ib] = null
    owner[ib] = ia
  }
  return pieces.filter((x): x is number[] => x !== null).map((x) => x.map((i) => ring[i]!))
}

/** The part of convex `subject` inside convex `clip` (Sutherland–Hodgman), or null when they share no area. */
export function clipConvex(subject: Ring, clip: Ring): Ring | null {
  const sign = signedArea(clip) > 0 ? 1 : -1
  let out: Ring = subject
  for (let i = 0, n = clip.length; i < n && out.length; i++) {
    const a = clip[i]!
    const b = clip[(i + 1) % n]!
    const input = out
    out = []
    for (let j = 0, m = input.length; j < m; j++) {
      const p = input[j]!
      const q = input[(j + 1) % m]!
      const dp = cross(a, b, p) * sign
      const dq = cross(a, b, q) * sign
      if (dp >= 0) out.push(p)
      if ((dp > 0 && dq < 0) || (dp < 0 && dq > 0)) {
        const t = dp / (dp - dq)
        out.push([p[0] + t * (q[0] - p[0]), p[1] + t * (q[1] - p[1])])
      }
    }
  }
  return out.length >= 3 && signedArea(out) !== 0 ? out : null
}
