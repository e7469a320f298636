import { describe, it, expect } from 'vitest'
import { yardDocument, MAX_PLANTINGS, MAX_AREAS } from '#shared/schemas/yard-document'

const rect = (x: number, y: number, w: number, h: number) => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]
const plant = (i: number) => ({ id: `p${i}`, species: 'Quercus alba', x: 1, y: 1 })

function fieldsOf(input: unknown): Record<string, string> {
  const r = yardDocument.safeParse(input)
  expect(r.success).toBe(false)
  return Object.fromEntries(r.error!.issues.map((i) => [i.path.join('.'), i.message]))
}

describe('yard document schema', () => {
  it('accepts a document and fills defaults', () => {
    const doc = yardDocument.parse({ boundary: rect(0, 0, 10, 10), plantings: [plant(0), { id: 'd', species: null, points: rect(1, 1, 2, 2), spacing: null }] })
    expect(doc).toMatchObject({ format: 'wildward.yard/1', units: 'ft', areas: [], lines: [] })
  })

  it('names the element and its id in each refusal', () => {
    const fields = fieldsOf({
      areas: [{ id: 'house', kind: 'building', points: rect(0, 0, 2, 2) }, { id: 'shed', kind: 'building', points: [[0, 0], [1, 1]] }],
      plantings: [plant(0), { ...plant(1), count: 0 }, plant(2), { ...plant(3), x: Infinity }, { ...plant(4), spread: Number.NaN }],
    })
    expect(fields['areas.1.points']).toMatch(/^Area "shed": A shape needs at least 3 points/)
    expect(fields['plantings.1.count']).toMatch(/^Planting "p1": A count is at least 1/)
    expect(fields['plantings.3.x']).toMatch(/^Planting "p3": /)
    expect(fields['plantings.4.spread']).toMatch(/^Planting "p4": /)
    expect(Object.keys(fields).sort()).toEqual(['areas.1.points', 'plantings.1.count', 'plantings.3.x', 'plantings.4.spread'])
    // outlines and positions are checked once every field is well formed
    const bowtie = [[0, 0], [2, 2], [2, 0], [0, 2]]
    const shapes = fieldsOf({
      areas: [{ id: 'patio', kind: 'paving', points: bowtie }],
      plantings: [plant(0), { id: 'drift-7', species: null, points: bowtie }, { id: 'half', species: null, x: 1 }, { id: 'both', species: null, x: 1, y: 1, points: rect(0, 0, 1, 1) }],
    })
    expect(shapes).toEqual({
      'areas.0.points': expect.stringMatching(/^Area "patio": The outline crosses itself/),
      'plantings.1.points': expect.stringMatching(/^Planting "drift-7": The outline crosses itself/),
      'plantings.2.y': 'Planting "half": A point planting needs both x and y',
      'plantings.3': 'Planting "both": A planting is either a point (x, y) or an area (points), not both',
    })
  })

  it('refuses yards over 5,000 plantings or 2,000 areas', () => {
    expect(yardDocument.safeParse({ plantings: Array.from({ length: MAX_PLANTINGS }, (_, i) => plant(i)) }).success).toBe(true)
    expect(fieldsOf({ plantings: Array.from({ length: MAX_PLANTINGS + 1 }, (_, i) => plant(i)) }).plantings).toMatch(/at most 5000 plantings/)
    const area = (i: number) => ({ id: `a${i}`, kind: 'bed', points: rect(i, 0, 1, 1) })
    expect(fieldsOf({ areas: Array.from({ length: MAX_AREAS + 1 }, (_, i) => area(i)) }).areas).toMatch(/at most 2000 areas/)
  })

  it('refuses a crossed lot outline and duplicate ids', () => {
    expect(fieldsOf({ boundary: [[0, 0], [10, 10], [10, 0], [0, 10]] }).boundary).toMatch(/crosses itself/)
    expect(fieldsOf({ plantings: [plant(1), plant(1)] })['plantings.1.id']).toMatch(/Duplicate element id "p1"/)
  })
})
