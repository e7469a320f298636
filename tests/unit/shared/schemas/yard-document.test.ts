import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { yardDocument, yardDocumentShape, MAX_PLANTINGS, MAX_AREAS } from '#shared/schemas/yard-document'

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
    // a document read now is written in the current format (issue: export writes /2, /1 still reads)
    expect(doc).toMatchObject({ format: 'wildward.yard/2', units: 'ft', areas: [], lines: [] })
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

describe('the fast path for long lists', () => {
  it('accepts and builds exactly what the plain zod schema does', () => {
    // edge values on both sides of every limit, wrong types, and junk keys
    const num = fc.constantFrom(-20_001, -20_000, -1, 0, 0.5, 1, 1.5, 2, 20, 60, 61, 120, 121, 100_000, 100_001, 1e9, Number.NaN, Infinity, -0)
    const str = fc.constantFrom('', ' ', 'a', '  Quercus alba ', 'x'.repeat(64), 'x'.repeat(65), 'y'.repeat(201))
    const val = fc.oneof(num, str, fc.constant(null), fc.constant(true), fc.constant([]), fc.constant({}))
    const pt = fc.oneof(fc.tuple(num, num), fc.tuple(num), fc.tuple(num, num, num), fc.constant('p'))
    const grid = fc.constantFrom<number[][]>([[0, 0], [4, 0], [4, 3], [0, 3]], [[0, 0, 1], [4, 0], [4, 3], [0, 3]], [[0, 0], [4, 0], [4], [0, 3]], [[0, 0], [2, 2], [2, 0], [0, 2]], [[0, 0], [1, 1]], [[0, 0], [5, 0], [0, 5]])
    const ring = fc.oneof(grid, fc.array(pt, { maxLength: 4 }), val)
    // a well-formed point or area planting or area, then up to two fields replaced by edge values (or a junk key)
    const mutate = <T extends Record<string, unknown>>(base: fc.Arbitrary<T>, fields: string[]) =>
      fc.tuple(base, fc.array(fc.tuple(fc.constantFrom(...fields, 'extra'), fc.oneof({ arbitrary: num, weight: 8 }, val, pt, ring, fc.constant(undefined))), { minLength: 1, maxLength: 2 }))
        .map(([b, changes]) => { const o: Record<string, unknown> = { ...b }; for (const [k, v] of changes) if (v === undefined) delete o[k]; else o[k] = v; return o })
    const plantingFields = ['id', 'species', 'cultivar', 'label', 'x', 'y', 'count', 'spread', 'z', 'points', 'spacing', 'height']
    const pointPlanting = fc.record({ id: fc.constant('p1'), species: fc.constantFrom('Quercus alba', '  Carex pensylvanica ', null), cultivar: fc.constantFrom(null, ' Dusk '), x: fc.constantFrom(0, 2.5, -20_000), y: fc.constant(3), count: fc.constantFrom(1, 7), spread: fc.constantFrom(0.5, 60), height: fc.constant(2) })
    const areaPlanting = fc.record({ id: fc.constant('p1'), species: fc.constantFrom('Poa pratensis', null), z: fc.constantFrom(0, -3, 6), points: grid, spacing: fc.constantFrom(null, 0.3, 20), label: fc.constant('Lawn') })
    const planting = mutate(fc.oneof(pointPlanting, areaPlanting), plantingFields)
    const area = mutate(fc.record({ id: fc.constant('a1'), kind: fc.constantFrom('bed', 'paving'), z: fc.constantFrom(0, 5), points: grid, sun: fc.constant('full'), soil: fc.constant('clay'), moisture: fc.constant('wet'), label: fc.constant('Front') }, { requiredKeys: ['id', 'kind', 'points'] }),
      ['id', 'kind', 'z', 'points', 'sun', 'soil', 'moisture', 'label'])
    // unique ids unless a mutation set one, so that most documents hinge on the mutated field
    const uniqueIds = (prefix: string) => (list: Record<string, unknown>[]) => list.map((o, i) => (o.id === 'p1' || o.id === 'a1' ? { ...o, id: `${prefix}${i}` } : o))
    const doc = fc.record({
      plantings: fc.oneof({ arbitrary: fc.array(planting, { maxLength: 3 }).map(uniqueIds('p')), weight: 5 }, val),
      areas: fc.oneof({ arbitrary: fc.array(area, { maxLength: 2 }).map(uniqueIds('a')), weight: 5 }, val),
      units: fc.constantFrom('ft', 'm', 'yd'),
    }, { requiredKeys: [] })
    let accepted = 0
    fc.assert(fc.property(doc, (input) => {
      const fast = yardDocument.safeParse(input)
      const plain = yardDocumentShape.safeParse(input)
      expect(fast.success).toBe(plain.success)
      if (plain.success) { accepted++; expect(fast.data).toEqual(plain.data) }
    }), { numRuns: 8000 })
    expect(accepted).toBeGreaterThan(400)
  }, 30_000)
})
