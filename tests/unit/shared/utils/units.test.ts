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
