// Phases, work marked done and the yard's share history over HTTP against real MariaDB; a pledge is reached by
// the yard as it is now, not by the plan.
import { describe, it, expect } from 'vitest'
import { newHomeowner } from '../../support/http'

const rect = (x: number, y: number, w: number, h: number) => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]
const yesterday = () => new Date(Date.now() - 86_400_000).toISOString().slice(0, 10)
const tomorrow = () => new Date(Date.now() + 2 * 86_400_000).toISOString().slice(0, 10)

/** A 10 m × 10 m lawn; a native sedge drift over its top 8 m to plant; a barberry (invasive in the demo list) to remove. */
const doc = () => ({
  format: 'wildward.yard/2', units: 'm', region: 'US-OH', boundary: rect(0, 0, 10, 10), areas: [], lines: [],
  plantings: [
    { id: 'lawn', species: 'Poa pratensis', points: rect(0, 0, 10, 10), z: 0, spacing: null, height: 0.08 },
    { id: 'drift', species: 'Carex pensylvanica', points: rect(0, 0, 10, 8), z: 6, spacing: 0.3, height: 0.2, phase: 'planned' },
    { id: 'barberry', species: 'Berberis thunbergii', x: 5, y: 9, count: 1, spread: 1, height: 1, phase: 'removing' },
  ],
})

describe('phases and work done', () => {
  it('scores now and with the plan; a pledge is reached only when the work is marked done; each change is in the history', async () => {
    const { client } = await newHomeowner('phases')
    const yard = (await client.post('/api/yards', { name: 'Before and after', region: 'US-OH', document: doc() })).body
    expect(yard.document.format).toBe('wildward.yard/2')
    const score = (await client.get(`/api/yards/${yard.id}/score`)).body
    // now: 100 m² of lawn (Kentucky bluegrass is native-and-introduced, not native) and the barberry: nothing native
    expect(score.now.area.share).toBe(0)
    // with the plan: the drift covers 80 of 100 m² (hand-worked), the barberry is gone
    expect(score.planned.area.share).toBeCloseTo(0.8, 9)
    expect(score.shares).toEqual(score.planned)

    const pledged = await client.post(`/api/yards/${yard.id}/pledge`, { neighbourhood: 'Phase Hill', consent: false })
    expect(pledged.status).toBe(201)
    // the plan alone meets a 70 % goal by cover, but the yard as it is now does not
    expect(pledged.body.pledge.status).toBe('pledged')
    expect(pledged.body.pledge.planned.area).toBeCloseTo(0.8, 9)

    // bad input: a planting to remove cannot be marked planted; no date in the future; a stale version
    const wrong = await client.post(`/api/yards/${yard.id}/work`, { version: yard.version, action: 'planted', ids: ['barberry'], date: yesterday() })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.fields['ids.0']).toMatch(/to remove/)
    const future = await client.post(`/api/yards/${yard.id}/work`, { version: yard.version, action: 'planted', ids: ['drift'], date: tomorrow() })
    expect(future.status).toBe(400)
    expect(Object.keys(future.body.data.fields)).toEqual(['date'])
    const badAction = await client.post(`/api/yards/${yard.id}/work`, { version: yard.version, action: 'sown', ids: ['drift'], date: yesterday() })
    expect(badAction.status).toBe(400)
    expect(badAction.body.data.fields.action).toBeTruthy()
    const stale = await client.post(`/api/yards/${yard.id}/work`, { version: yard.version + 5, action: 'planted', ids: ['drift'], date: yesterday() })
    expect(stale.status).toBe(409)
    expect((await client.get(`/api/yards/${yard.id}/history`)).body.points).toEqual([])

    const planted = await client.post(`/api/yards/${yard.id}/work`, { version: yard.version, action: 'planted', ids: ['drift'], date: yesterday() })
    expect(planted.status).toBe(200)
    expect(planted.body.version).toBe(yard.version + 1)
    // now: 80 m² of sedge of 100 m² + the barberry's π·0.5² m² (hand-worked)
    expect(planted.body.now.area.share).toBeCloseTo(80 / (100 + Math.PI * 0.25), 6)
    const state = (await client.get(`/api/yards/${yard.id}/pledge`)).body
    expect(state.pledge.status).toBe('reached')

    const saved = (await client.get(`/api/yards/${yard.id}`)).body
    expect(saved.document.plantings.find((p: { id: string }) => p.id === 'drift')).toMatchObject({ doneOn: yesterday() })
    expect(saved.document.plantings.find((p: { id: string }) => p.id === 'drift').phase).toBeUndefined()
    // the drift now stands there: the seed plan has nothing of it to raise
    const seeds = (await client.get(`/api/yards/${yard.id}/seed-plan`)).body
    expect(JSON.stringify(seeds)).not.toMatch(/Carex pensylvanica/)

    const removedWrong = await client.post(`/api/yards/${yard.id}/work`, { version: saved.version, action: 'removed', ids: ['drift'], date: yesterday() })
    expect(removedWrong.status).toBe(400)
    const removed = await client.post(`/api/yards/${yard.id}/work`, { version: saved.version, action: 'removed', ids: ['barberry'], date: yesterday() })
    expect(removed.status).toBe(200)
    expect(removed.body.now.area.share).toBeCloseTo(0.8, 9)

    const history = (await client.get(`/api/yards/${yard.id}/history`)).body.points
    expect(history.map((p: { action: string }) => p.action)).toEqual(['planted', 'removed'])
    expect(history[0]).toMatchObject({ day: yesterday(), items: 1 })
    expect(history[0].now.area).toBeCloseTo(80 / (100 + Math.PI * 0.25), 6)
    // the work added 80 m² of native cover and took 80 m² of lawn out (hand-worked)
    expect(history[0].nativeAreaAdded).toBeCloseTo(80, 6)
    expect(history[0].lawnRemoved).toBeCloseTo(80, 6)
    expect(history[1].now.area).toBeCloseTo(0.8, 9)
    expect((await client.get(`/api/yards/${yard.id}`)).body.document.plantings.map((p: { id: string }) => p.id)).toEqual(['lawn', 'drift'])
  })

  it('changes a phase by a save, refuses an unknown phase naming the field, and reads a /1 document as all there now', async () => {
    const { client } = await newHomeowner('phases2')
    const old = { ...doc(), format: 'wildward.yard/1', plantings: doc().plantings.map(({ phase: _p, ...p }) => p) }
    const yard = (await client.post('/api/yards', { name: 'Old format', region: 'US-OH', document: old })).body
    const score = (await client.get(`/api/yards/${yard.id}/score`)).body
    expect(score.now).toEqual(score.planned)
    const bad = await client.put(`/api/yards/${yard.id}`, { version: yard.version, document: { ...old, plantings: [old.plantings[0], { ...old.plantings[1], phase: 'someday' }] } })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.data.fields)).toEqual(['document.plantings.1.phase'])
    const next = await client.put(`/api/yards/${yard.id}`, { version: yard.version, document: { ...old, plantings: [old.plantings[0], { ...old.plantings[1], phase: 'planned' }, old.plantings[2]] } })
    expect(next.status).toBe(200)
    const after = (await client.get(`/api/yards/${yard.id}/score`)).body
    expect(after.planned.area.share).toBeGreaterThan(after.now.area.share)
  })
})
