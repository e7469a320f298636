import { describe, it, expect } from 'vitest'
import { ringArea, signedArea, firstSelfIntersection, centroid, pointInRing, type Ring } from '#shared/utils/polygon'

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
})
