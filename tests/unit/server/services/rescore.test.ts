import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { applyYardChanges, changesSince, yardSnapshot } from '#shared/utils/yard-changes'
import { assembleScore, scoreYard } from '../../../../server/services/scoring'
import { freshState, nextState, elementLocator, changedLines } from '../../../../server/services/rescore'
import { applyEdit, facts, randomEdits, randomYards, FIXTURE_FACTS } from './score-fixtures'

const wire = <T>(v: T): T => JSON.parse(JSON.stringify(v))

describe('re-scoring from the last state', () => {
  it('gives exactly a fresh score after every edit, redoing only point plantings when only they changed', () => {
    const kinds = { quick: 0, full: 0 }
    fc.assert(fc.property(randomYards(), randomEdits(8), ({ doc, goal }, edits) => {
      let state = freshState(wire(doc), facts())
      for (const [i, e] of edits.entries()) {
        // what the server does with the editor's changes: applied to its copy, sharing untouched elements
        const changes = wire(changesSince(yardSnapshot(state.doc), wire(applyEdit(state.doc, e, i)))!)
        const before = state
        const { doc: applied, issues } = applyYardChanges(before.doc, changes, elementLocator(before))
        expect(issues).toEqual([])
        const next = nextState(before, applied, changes, facts())
        kinds[next.quick ? 'quick' : 'full']++
        // reference: the same document scored from scratch, sharing nothing
        const fresh = scoreYard(wire(applied), facts(), goal)
        expect(assembleScore(next.state, goal)).toEqual(fresh)
        expect(next.changed).toEqual(changedLines(before.lines, fresh.plantings).changed)
        state = next.state
      }
    }), { numRuns: 200 })
    // both ways were exercised
    expect(kinds.quick).toBeGreaterThan(50)
    expect(kinds.full).toBeGreaterThan(50)
  }, 60_000)

  it('falls back to measuring everything when a species the yard names changes in the catalogue', () => {
    const base = wire({ format: 'wildward.yard/1' as const, region: 'US-OH', units: 'm' as const, boundary: [[0, 0], [10, 0], [10, 10], [0, 10]] as [number, number][], areas: [], lines: [],
      plantings: [{ id: 'a', species: 'Cornus sericea', x: 2, y: 2 }, { id: 'b', species: 'Quercus alba', x: 6, y: 6 }] })
    const state = freshState(base, facts())
    const changes = { plantings: { upsert: [{ id: 'b', species: 'Quercus alba', x: 7, y: 6 }] } }
    const applied = applyYardChanges(state.doc, changes).doc
    // the catalogue now says the dogwood is introduced
    const changed = facts(FIXTURE_FACTS.map((f) => (f.scientificName === 'Cornus sericea' ? { ...f, status: 'introduced' as const } : f)))
    const next = nextState(state, applied, changes, changed)
    expect(next.quick).toBe(false)
    expect(next.state.lines.find((l) => l.id === 'a')!.status).toBe('introduced')
    expect(assembleScore(next.state, 0.7)).toEqual(scoreYard(wire(applied), changed, 0.7))
  })
})
