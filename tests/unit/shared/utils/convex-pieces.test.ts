import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import polygonClipping from 'polygon-clipping'
import { clipConvex, triangulate } from '#shared/utils/convex-pieces'
import { ringArea, type Ring } from '#shared/utils/polygon'

describe('triangulate', () => {
  it('cuts an L-shaped outline into triangles that tile it', () => {
    // an L of a 4 × 4 square less its 2 × 2 corner: 16 − 4 = 12 m² (hand-worked), in n − 2 = 4 triangles
    const l: Ring = [[0, 0], [4, 0], [4, 2], [2, 2], [2, 4], [0, 4]]
    const t = triangulate(l)!
    expect(t).toHaveLength(4)
    expect(t.reduce((s, x) => s + ringArea(x), 0)).toBeCloseTo(12, 12)
  })

  it('drops vertices on a straight edge and refuses an outline that touches itself', () => {
    expect(triangulate([[0, 0], [2, 0], [4, 0], [4, 4], [0, 4]])!.reduce((s, x) => s + ringArea(x), 0)).toBeCloseTo(16, 12)
    // a bow-tie with lobes of unequal size: no set of triangles of its vertices tiles it with its signed area
    expect(triangulate([[0, 0], [4, 4], [4, 0], [0, 2]])).toBeNull()
  })
})

describe('clipConvex', () => {
  it('gives the overlap of two convex outlines as polygon-clipping does', () => {
    const g = fc.integer({ min: 0, max: 10 })
    const tri = fc.tuple(g, g, g, g, g, g).filter(([a, b, c, d, e, f]) => (c - a) * (f - b) - (d - b) * (e - a) !== 0).map(([a, b, c, d, e, f]): Ring => [[a, b], [c, d], [e, f]])
    fc.assert(fc.property(tri, tri, (a, b) => {
      let expected = 0
      try { expected = polygonClipping.intersection([a] as never, [b] as never).reduce((s, p) => s + ringArea(p[0] as Ring), 0) } catch { fc.pre(false) }
      const got = clipConvex(a, b)
      expect(got ? ringArea(got) : 0).toBeCloseTo(expected, 9)
    }), { numRuns: 500 })
  })
})
