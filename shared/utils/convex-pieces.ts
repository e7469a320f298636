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
  const total = Math.abs(signedArea(ring))
  if (total === 0) return []
  const sign = signedArea(ring) > 0 ? 1 : -1
  const idx = ring.map((_, i) => i)
  const out: Ring[] = []
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
      out.push([a, b, c])
      idx.splice(k, 1)
      found = true
      break
    }
    if (!found) return null
  }
  if (idx.length === 3) out.push(idx.map((i) => ring[i]!))
  // the triangles must tile the outline exactly (else it was not simple)
  const sum = out.reduce((s, t) => s + Math.abs(signedArea(t)), 0)
  return Math.abs(sum - total) <= 1e-9 * Math.max(1, total) ? out.filter((t) => signedArea(t) !== 0) : null
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
