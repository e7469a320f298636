import { describe, it, expect } from 'vitest'
import { applyRecommendation, describeRecommendation, RecommendationError } from '../../../../shared/utils/recommendations'
import { emptyYardDocument, type YardDocument } from '../../../../shared/schemas/yard-document'

const rect = (x: number, y: number, w: number, h: number): [number, number][] => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]
function doc(): YardDocument {
  return emptyYardDocument({
    boundary: rect(0, 0, 10, 10),
    areas: [{ id: 'bed', kind: 'bed', z: 5, points: rect(1, 1, 4, 2), label: 'Front bed' }],
    plantings: [
      { id: 'lawn', species: 'Poa pratensis', points: rect(0, 0, 10, 10), z: 0, spacing: null, height: 0.08 },
      { id: 'drift', species: 'Carex pensylvanica', points: rect(1, 1, 4, 2), z: 6, spacing: 0.3, height: 0.2 },
      { id: 'barberry', species: 'Berberis thunbergii', x: 8, y: 8, count: 3, spread: 1.2, height: 1.2, label: 'Barberry hedge' },
    ],
  })
}

describe('applyRecommendation', () => {
  it('marks a planting there now to remove and plans its replacement in the same spot, leaving the original document alone', () => {
    const before = doc()
    const after = applyRecommendation(before, { kind: 'replace', plantingId: 'barberry', species: 'Ilex verticillata', spread: 2, height: 2.5 }, 'rec-1')
    expect(after.plantings[2]).toMatchObject({ id: 'barberry', species: 'Berberis thunbergii', phase: 'removing' })
    expect(after.plantings[3]).toEqual({ id: 'rec-1', species: 'Ilex verticillata', cultivar: null, x: 8, y: 8, count: 3, spread: 2, height: 2.5, phase: 'planned' })
    expect(before.plantings[2]!.species).toBe('Berberis thunbergii')
    expect(before.plantings[2]!.phase).toBeUndefined()
  })

  it('changes a planting still only planned in place', () => {
    const d = doc()
    d.plantings[2] = { ...d.plantings[2]!, phase: 'planned' }
    const after = applyRecommendation(d, { kind: 'replace', plantingId: 'barberry', species: 'Ilex verticillata' }, 'rec-1')
    expect(after.plantings).toHaveLength(d.plantings.length)
    expect(after.plantings[2]).toMatchObject({ id: 'barberry', species: 'Ilex verticillata', phase: 'planned' })
  })

  it('adds a clump at the centre of the bed (the centroid of a rectangle is its centre: elementary geometry)', () => {
    const after = applyRecommendation(doc(), { kind: 'add', bedId: 'bed', species: 'Asclepias tuberosa', count: 5, spread: 0.45, height: 0.6 }, 'rec-2')
    expect(after.plantings.at(-1)).toEqual({ id: 'rec-2', species: 'Asclepias tuberosa', cultivar: null, x: 3, y: 2, count: 5, spread: 0.45, height: 0.6, phase: 'planned' })
  })

  it('draws a lawn conversion above every other area planting, with an id that does not clash', () => {
    const d = doc()
    d.plantings.push({ id: 'rec-3', species: 'x', x: 1, y: 1 })
    const after = applyRecommendation(d, { kind: 'convertLawn', points: rect(5, 4, 4, 3), species: 'Schizachyrium scoparium', spacing: 0.45, height: 0.9 }, 'rec-3')
    const added = after.plantings.at(-1)!
    expect(added.id).toBe('rec-3-2')
    expect(added.z).toBe(7)
    expect(added.points).toEqual(rect(5, 4, 4, 3))
  })

  it('names the field when the planting or bed is gone', () => {
    expect(() => applyRecommendation(doc(), { kind: 'replace', plantingId: 'gone', species: 'A b' }, 'r')).toThrow(RecommendationError)
    let field = ''
    try {
      // "drift" is a planting, not a bed
      applyRecommendation(doc(), { kind: 'add', bedId: 'drift', species: 'A b', count: 1, spread: 1, height: 1 }, 'r')
    } catch (e) {
      field = (e as RecommendationError).field
    }
    expect(field).toBe('change.bedId')
  })

  it('describes the change in words', () => {
    expect(describeRecommendation(doc(), { kind: 'replace', plantingId: 'barberry', species: 'Ilex verticillata' })).toBe('Replace Barberry hedge with Ilex verticillata')
    expect(describeRecommendation(doc(), { kind: 'add', bedId: 'bed', species: 'Asclepias tuberosa', count: 5, spread: 0.45, height: 0.6 })).toBe('Add 5 × Asclepias tuberosa in Front bed')
  })
})
