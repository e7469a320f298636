import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { applyYardChanges, changesSince, yardSnapshot } from '#shared/utils/yard-changes'
import { applyEdit, randomEdits, randomYards, rect, yard } from '../../server/services/score-fixtures'

describe('yard changes', () => {
  it('applied to the earlier document, give the later one (over random yards and edits)', () => {
    fc.assert(fc.property(randomYards(), randomEdits(), ({ doc }, edits) => {
      // both ends of the wire hold JSON (no undefined keys, no -0)
      const wire = <T>(v: T): T => JSON.parse(JSON.stringify(v))
      let before = wire(doc)
      for (const [i, e] of edits.entries()) {
        const after = wire(applyEdit(before, e, i))
        const changes = changesSince(yardSnapshot(before), after)
        expect(changes).not.toBeNull()
        // what goes over the wire is JSON
        const { doc: rebuilt, issues } = applyYardChanges(before, wire(changes)!)
        expect(issues).toEqual([])
        expect(rebuilt).toEqual(after)
        before = after
      }
    }), { numRuns: 200 })
  })

  it('keep untouched elements as the same objects, so their results can be reused', () => {
    const base = yard({ plantings: [{ id: 'a', species: null, x: 1, y: 1 }, { id: 'b', species: null, x: 2, y: 2 }] })
    const next = { ...base, plantings: [base.plantings[0]!, { ...base.plantings[1]!, x: 3 }] }
    const changes = changesSince(yardSnapshot(base), next)!
    expect(changes).toEqual({ plantings: { upsert: [{ id: 'b', species: null, x: 3, y: 2 }] } })
    const { doc } = applyYardChanges(base, changes)
    expect(doc.plantings[0]).toBe(base.plantings[0])
    expect(doc.areas).toBe(base.areas)
  })

  it('are not used for a reorder: the whole document goes instead', () => {
    const base = yard({ plantings: [{ id: 'a', species: null, x: 1, y: 1 }, { id: 'b', species: null, x: 2, y: 2 }] })
    expect(changesSince(yardSnapshot(base), { ...base, plantings: [base.plantings[1]!, base.plantings[0]!] })).toBeNull()
  })

  it('name what is wrong, by its place in the request', () => {
    const base = yard({ areas: [{ id: 'bed', kind: 'bed', z: 0, points: rect(0, 0, 2, 2) }], plantings: [{ id: 'a', species: null, x: 1, y: 1 }] })
    const bowtie: [number, number][] = [[0, 0], [2, 2], [2, 0], [0, 2]]
    const { issues } = applyYardChanges(base, {
      plantings: { upsert: [{ id: 'd', species: null, points: bowtie }], remove: ['nope'] },
      fields: { units: null as never },
    })
    expect(issues.map((i) => i.path.join('.')).sort()).toEqual(['changes.fields.units', 'changes.plantings.remove.0', 'changes.plantings.upsert.0.points'])
    // a new planting may not take the id of an area
    const dup = applyYardChanges(base, { plantings: { upsert: [{ id: 'bed', species: null, x: 1, y: 1 }] } })
    expect(dup.issues).toEqual([{ path: ['changes', 'plantings', 1, 'id'], message: 'Duplicate element id "bed"' }])
  })
})
