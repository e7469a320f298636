import { describe, it, expect } from 'vitest'
import { plantsNeeded, plantsPerArea, areaForPlants, TRIANGULAR_FACTOR } from '#shared/utils/plant-count'
import { SQUARE_METRES_PER_SQUARE_FOOT } from '#shared/utils/units'

const INCH = 0.0254 // international inch, 1959: exactly 0.0254 m
const HUNDRED_SQ_FT = 100 * SQUARE_METRES_PER_SQUARE_FOOT

describe('plants from spacing', () => {
  it('square layout matches the Mississippi State University Extension "Ground Covers" table', () => {
    // MSU Extension, "Ground Covers": plants per 100 sq ft at 6, 8, 9, 12, 18, 24 inch spacing (rounded up)
    const table: Array<[number, number]> = [[6, 400], [8, 225], [9, 178], [12, 100], [18, 45], [24, 25]]
    for (const [inches, plants] of table) expect(plantsNeeded(HUNDRED_SQ_FT, inches * INCH, 'square'), `${inches} in`).toBe(plants)
  })

  it('triangular layout is the square count ÷ 0.866', () => {
    // equilateral spacing: each plant takes (√3/2)·s² = 0.866 s² (product brief, "Core computations")
    expect(TRIANGULAR_FACTOR).toBeCloseTo(0.866, 3)
    for (const inches of [6, 8, 9, 12, 18, 24]) {
      const square = plantsPerArea(HUNDRED_SQ_FT, inches * INCH, 'square')
      expect(plantsPerArea(HUNDRED_SQ_FT, inches * INCH, 'triangular') / (square / 0.866)).toBeCloseTo(1, 4)
    }
    // 12 in triangular: 100 ÷ 0.866 = 115.47 → 116 plants
    expect(plantsNeeded(HUNDRED_SQ_FT, 12 * INCH)).toBe(116)
  })

  it('inverts, and gives nothing for nothing', () => {
    expect(plantsNeeded(areaForPlants(37, 0.45), 0.45)).toBe(37)
    expect(plantsNeeded(0, 0.3)).toBe(0)
    expect(plantsPerArea(10, 0)).toBe(0)
  })
})
