import { describe, it, expect } from 'vitest'
import { sampleDoc } from './yard-fixtures'
import {
  snapStep, snapValue, driftPlantCount, translateElements, duplicateElements, deleteElements, shiftZ,
  layeredShapes, hitTest, elementsInBox, distanceToPolygon, plantRadius,
} from '#shared/utils/yard-edits'
import { distanceToSegment } from '#shared/utils/geometry'


describe('snapping', () => {
  it('snaps to half a foot (0.1524 m: 0.5 × 0.3048, international foot) or to 0.1 m', () => {
    expect(snapStep('ft')).toBeCloseTo(0.1524, 12)
    expect(snapStep('m')).toBe(0.1)
    expect(snapValue(0.33, 0.1)).toBe(0.3)
    expect(snapValue(1.0, snapStep('ft'))).toBeCloseTo(7 * 0.1524, 9)
  })
})

describe('drift plant count', () => {
  it('uses a triangular layout, n = area / (0.866 s²), rounded up (product brief, "Three shares")', () => {
    // 10 m² at 0.5 m spacing: 10 / (0.866 × 0.25) = 46.19 → 47
    expect(driftPlantCount([[0, 0], [5, 0], [5, 2], [0, 2]], 0.5)).toBe(47)
    expect(driftPlantCount([[0, 0], [5, 0], [5, 2], [0, 2]], null)).toBeNull()
  })
})

describe('document edits', () => {
  it('translates points, plants and lines', () => {
    const d = sampleDoc()
    translateElements(d, ['oak', 'bed', 'wire', 'lot'], 1, -1)
    expect([d.plantings[1]!.x, d.plantings[1]!.y]).toEqual([16, 4])
    expect(d.areas[1]!.points[0]).toEqual([9, 1])
    expect(d.lines[0]!.points[1]).toEqual([21, 8])
    expect(d.boundary[2]).toEqual([21, 9])
  })
  it('duplicates with fresh ids and leaves the original alone', () => {
    const d = sampleDoc()
    const [copy] = duplicateElements(d, ['oak'], 2, 0)
    expect(copy).not.toBe('oak')
    expect(d.plantings.find((p) => p.id === copy)?.x).toBe(17)
    expect(d.plantings.find((p) => p.id === 'oak')?.x).toBe(15)
  })
  it('deletes elements and the lot', () => {
    const d = sampleDoc()
    deleteElements(d, ['lot', 'bed', 'aster'])
    expect(d.boundary).toEqual([])
    expect(d.areas.map((a) => a.id)).toEqual(['house'])
    expect(d.plantings.map((p) => p.id)).toEqual(['lawn', 'oak'])
  })
  it('moves areas one step up or down the drawing order', () => {
    const d = sampleDoc()
    expect(layeredShapes(d).map((s) => s.id)).toEqual(['lawn', 'bed', 'house'])
    shiftZ(d, ['lawn'], 1)
    expect(layeredShapes(d).map((s) => s.id)).toEqual(['bed', 'lawn', 'house'])
    shiftZ(d, ['house'], -1)
    expect(layeredShapes(d).map((s) => s.id)).toEqual(['bed', 'house', 'lawn'])
  })
})

describe('hit-testing and geometry', () => {
  it('finds the smallest plant first, then the topmost area', () => {
    const d = sampleDoc()
    expect(hitTest(d, [10, 4], 0.05)).toBe('aster')
    expect(hitTest(d, [14, 5], 0.05)).toBe('oak')
    expect(hitTest(d, [9, 5.5], 0.05)).toBe('bed')
    expect(hitTest(d, [2, 8], 0.05)).toBe('lawn')
    expect(hitTest(d, [3, 9.02], 0.05)).toBe('wire')
  })
  it('selects what lies wholly inside a box', () => {
    expect(elementsInBox(sampleDoc(), { minX: 7, minY: 1, maxX: 13, maxY: 7 }).sort()).toEqual(['aster', 'bed'])
  })
  it('measures distances to segments and polygons (3-4-5 triangle)', () => {
    expect(distanceToSegment([3, 4], [0, 0], [0, 0])).toBe(5)
    expect(distanceToSegment([3, 4], [-10, 0], [10, 0])).toBe(4)
    expect(distanceToPolygon([2, 2], [[0, 0], [4, 0], [4, 4], [0, 4]])).toBe(0)
    expect(distanceToPolygon([7, 4], [[0, 0], [4, 0], [4, 4], [0, 4]])).toBe(3)
  })
  it('draws a clump of n plants as one circle of the same total area (n × π r²)', () => {
    expect(plantRadius({ id: 'c', species: null, x: 0, y: 0, count: 4, spread: 1 })).toBeCloseTo(1, 12)
  })
})
