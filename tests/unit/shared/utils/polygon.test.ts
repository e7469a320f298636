import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { ringArea, signedArea, firstSelfIntersection, segmentsIntersect, centroid, pointInRing, type Ring } from '#shared/utils/polygon'

/** The straightforward check, every pair of non-adjacent edges: what the grid version must agree with. */
function allPairsSelfIntersection(ring: Ring): number {
  const n = ring.length
  if (n < 3 || ringArea(ring) === 0) return 0
  for (let i = 0; i < n; i++) {
    const a = ring[i]!, b = ring[(i + 1) % n]!
    if (a[0] === b[0] && a[1] === b[1]) return i
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue
      if (segmentsIntersect(a, b, ring[j]!, ring[(j + 1) % n]!)) return i
    }
  }
  return -1
}

describe('polygon helpers', () => {
  it('measures a hand-worked shoelace example', () => {
    // Hand-worked shoelace: (0,0) (4,0) (4,3) (0,3) → ½|0·0−4·0 + 4·3−4·0 + 4·3−0·3 + 0·0−0·3| = ½·24 = 12
    expect(ringArea([[0, 0], [4, 0], [4, 3], [0, 3]])).toBe(12)
    // an L shape: 4×4 square less a 2×2 corner = 12 (hand-worked)
    expect(ringArea([[0, 0], [4, 0], [4, 2], [2, 2], [2, 4], [0, 4]])).toBe(12)
    // winding flips the sign, not the size
    expect(signedArea([[0, 0], [0, 3], [4, 3], [4, 0]])).toBe(-12)
  })

  it('finds self-intersections and degenerate rings', () => {
    const bowtie: Ring = [[0, 0], [10, 10], [10, 0], [0, 10]]
    expect(firstSelfIntersection(bowtie)).toBeGreaterThanOrEqual(0)
    expect(firstSelfIntersection([[0, 0], [5, 0], [10, 0]])).toBe(0) // collinear: no area
    expect(firstSelfIntersection([[0, 0], [4, 0], [4, 2], [2, 2], [2, 4], [0, 4]])).toBe(-1)
    // a ring that touches itself at a vertex is refused too
    expect(firstSelfIntersection([[0, 0], [4, 0], [2, 2], [4, 4], [0, 4], [2, 2]])).toBeGreaterThanOrEqual(0)
  })

  it('finds the centroid and containment', () => {
    expect(centroid([[0, 0], [4, 0], [4, 2], [0, 2]])).toEqual([2, 1])
    expect(pointInRing([1, 1], [[0, 0], [4, 0], [4, 2], [0, 2]])).toBe(true)
    expect(pointInRing([5, 1], [[0, 0], [4, 0], [4, 2], [0, 2]])).toBe(false)
  })

  it('agrees with the all-pairs check on random outlines, touching and collinear ones included', () => {
    // small integer grids make shared vertices, collinear overlaps and edges along cell borders common
    const ring = (grid: number) => fc.array(fc.tuple(fc.integer({ min: 0, max: grid }), fc.integer({ min: 0, max: grid })), { minLength: 3, maxLength: 120 })
    fc.assert(fc.property(fc.oneof(ring(4), ring(12), ring(1000)), (pts) => {
      expect(firstSelfIntersection(pts as Ring)).toBe(allPairsSelfIntersection(pts as Ring))
    }), { numRuns: 3000 })
    // star-shaped (simple) outlines sorted by angle, with many vertices
    fc.assert(fc.property(fc.array(fc.tuple(fc.double({ min: 0, max: 2 * Math.PI, noNaN: true }), fc.double({ min: 1, max: 100, noNaN: true })), { minLength: 3, maxLength: 300 }), (polar) => {
      const pts = polar.sort((a, b) => a[0] - b[0]).map(([t, r]) => [r * Math.cos(t), r * Math.sin(t)] as [number, number])
      expect(firstSelfIntersection(pts)).toBe(allPairsSelfIntersection(pts))
    }), { numRuns: 300 })
  })
})
