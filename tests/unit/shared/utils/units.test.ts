import { describe, it, expect } from 'vitest'
import { METRES_PER_FOOT, SQUARE_METRES_PER_SQUARE_FOOT, toDisplayLength, fromDisplayLength, formatArea } from '#shared/utils/units'

describe('units', () => {
  it('uses the international foot', () => {
    // International yard and pound agreement (1959): 1 ft = 0.3048 m exactly
    expect(METRES_PER_FOOT).toBe(0.3048)
    // 0.3048² = 0.09290304 m² per square foot (exact)
    expect(SQUARE_METRES_PER_SQUARE_FOOT).toBeCloseTo(0.09290304, 15)
  })
  it('round-trips lengths and formats areas', () => {
    expect(fromDisplayLength(toDisplayLength(7.315, 'ft'), 'ft')).toBeCloseTo(7.315, 12)
    expect(toDisplayLength(3.048, 'ft')).toBeCloseTo(10, 12)
    expect(formatArea(9.290304, 'ft')).toBe('100 sq ft')
    expect(formatArea(12.4, 'm')).toBe('12 m²')
  })
})

describe('areaAtLeast', () => {
  it('rounds an area up to three significant figures in the yard units, never down', async () => {
    const { areaAtLeast } = await import('#shared/utils/units')
    // 60 m² = 645.83 sq ft (1 ft = 0.3048 m) → 646 sq ft; 22.81 m² → 22.9 m²; 1,234.1 m² → 1,240 m² (hand-worked)
    expect(areaAtLeast(60, 'ft').text).toBe('646 sq ft')
    expect(areaAtLeast(22.81, 'm')).toEqual({ squareMetres: 22.9, text: '22.9 m²' })
    expect(areaAtLeast(1234.1, 'm').text).toBe('1,240 m²')
    expect(areaAtLeast(60, 'm').text).toBe('60 m²')
    for (const x of [0.0123, 0.5, 7.77, 99.99, 100.01, 5432.1]) {
      for (const u of ['m', 'ft'] as const) {
        const { squareMetres } = areaAtLeast(x, u)
        expect(squareMetres).toBeGreaterThanOrEqual(x * (1 - 1e-12))
        expect(squareMetres).toBeLessThan(x * 1.01)
      }
    }
  })
})
