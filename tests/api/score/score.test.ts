import { describe, it, expect } from 'vitest'
import { Client, demo, newHomeowner } from '../../support/http'
import { scoreSchema, scoreUpdateSchema, scoreWithBasisSchema } from '#shared/schemas/score'
import { mergeScoreUpdate } from '#shared/utils/yard-changes'

const rect = (x: number, y: number, w: number, h: number) => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]
const lawnAndBed = {
  region: 'US-OH', units: 'm', boundary: rect(0, 0, 10, 10),
  areas: [{ id: 'bed', kind: 'bed', z: 5, points: rect(1, 1, 4, 5) }],
  plantings: [
    { id: 'lawn', species: 'Poa pratensis', z: 0, points: rect(0, 0, 10, 10), spacing: null, height: 0.1 },
    { id: 'sedge', species: 'Carex pensylvanica', z: 5, points: rect(1, 1, 4, 5), spacing: 0.5, height: 0.2 },
    { id: 'oak', species: 'Quercus alba', x: 7, y: 7, count: 1, spread: 4, height: 10 },
    { id: 'barberry', species: 'Berberis thunbergii', x: 8, y: 2, count: 3, spread: 1, height: 1 },
    { id: 'mystery', species: null, x: 2, y: 8, count: 1, spread: 1, height: 1 },
  ],
}

describe('POST /api/score', () => {
  it('scores a posted document in the response shape, storing nothing', async () => {
    const { client } = await newHomeowner('score')
    const r = await client.post('/api/score', lawnAndBed)
    expect(r.status).toBe(200)
    expect(scoreWithBasisSchema.parse(r.body)).toEqual(r.body)
    // the goal is the organisation's (default 0.70, Narango, Tallamy & Marra 2018, PNAS 115(45):11549–11554)
    expect(r.body.goal).toBe(0.7)
    const byId = Object.fromEntries(r.body.plantings.map((p: { id: string }) => [p.id, p]))
    // hand-worked: lawn 100 − 20 m² under the bed; sedge 20 m² at 0.5 m triangular = ⌈20/(0.866·0.25)⌉ = 93 plants
    expect(byId.lawn).toMatchObject({ status: 'nativeAndIntroduced', area: 80, count: null })
    expect(byId.sedge).toMatchObject({ status: 'native', area: 20, count: 93 })
    expect(byId.barberry.status).toBe('invasive')
    expect(byId.mystery.status).toBe('unknown')
    // count: 93 sedges + 1 oak native of 93 + 1 + 3 + 1 plants
    expect(r.body.shares.count).toEqual({ native: 94, total: 98, share: 94 / 98 })
    expect(r.body.moves[0]).toMatchObject({ share: 'area', kind: 'replace-invasive', unit: 'plants', amount: 3 })
    expect((await client.get('/api/yards')).body.items).toEqual([])
  })

  it('gives null shares for an empty yard', async () => {
    const r = await (await demo('homeowner')).post('/api/score', {})
    expect(r.status).toBe(200)
    expect(r.body.shares.area).toEqual({ native: 0, total: 0, share: null })
  })

  it('refuses a bad document with a 400 naming the element and its id', async () => {
    const client = await demo('homeowner')
    const bowtie = [[0, 0], [2, 2], [2, 0], [0, 2]]
    const crossed = await client.post('/api/score', { ...lawnAndBed, plantings: [...lawnAndBed.plantings.slice(0, 3), { id: 'drift-9', species: null, points: bowtie }] })
    expect(crossed.status).toBe(400)
    expect(crossed.body.data.fields['plantings.3.points']).toMatch(/crosses itself/)
    expect(crossed.body.message).toContain('drift-9')
    const zero = await client.post('/api/score', { plantings: [{ id: 'few', species: null, x: 1, y: 1, count: 0 }] })
    expect(Object.keys(zero.body.data.fields)).toEqual(['plantings.0.count'])
    expect(zero.body.message).toContain('few')
    const short = await client.post('/api/score', { areas: [{ id: 'sliver', kind: 'bed', points: [[0, 0], [1, 1]] }] })
    expect(short.body.data.fields['areas.0.points']).toMatch(/at least 3 points/)
    // JSON has no Infinity, but 1e999 parses to it
    const res = await client.request('POST', '/api/score', '{"plantings":[{"id":"far","species":null,"x":1e999,"y":1}]}', { 'content-type': 'application/json' })
    const inf = res.body
    expect(res.status).toBe(400)
    expect(Object.keys(inf.data.fields)).toEqual(['plantings.0.x'])
    expect(inf.message).toContain('far')
    const many = await client.post('/api/score', { plantings: Array.from({ length: 5001 }, (_, i) => ({ id: `p${i}`, species: null, x: 1, y: 1 })) })
    expect(many.status).toBe(400)
    expect(many.body.data.fields.plantings).toMatch(/at most 5000/)
  })

  it('asks anonymous callers to sign in', async () => {
    expect((await new Client().post('/api/score', lawnAndBed)).status).toBe(401)
  })
})

describe('POST /api/score with changes to an earlier answer', () => {
  const strip = ({ basis: _b, ...score }: Record<string, unknown>) => score

  it('gives the score the whole changed document gets, sending back only the lines that changed', async () => {
    const { client } = await newHomeowner('rescore')
    const first = await client.post('/api/score', lawnAndBed)
    expect(first.status).toBe(200)
    const changes = {
      plantings: {
        upsert: [
          { id: 'oak', species: 'Quercus alba', x: 3, y: 7, count: 1, spread: 4, height: 10 },
          { id: 'asters', species: 'Symphyotrichum novae-angliae', z: 6, points: rect(6, 1, 2, 2), spacing: 0.45 },
        ],
        remove: ['barberry'],
      },
      fields: { name: 'Front yard' },
    }
    const update = await client.post('/api/score', { basis: first.body.basis, changes })
    expect(update.status).toBe(200)
    expect(scoreUpdateSchema.parse(update.body)).toEqual(update.body)
    expect(update.body.since).toBe(first.body.basis)
    expect(update.body.basis).not.toBe(first.body.basis)
    expect(update.body.removedPlantings).toEqual(['barberry'])
    // the asters are new and cover 4 m² of lawn, so the lawn's line changed; the oak moved but still stands wholly
    // in the lot, so its figures (and the sedge's and the unidentified plant's) are as before
    expect(update.body.plantings.map((p: { id: string }) => p.id).sort()).toEqual(['asters', 'lawn'])

    // reference: the changed document posted whole
    const changed = { ...lawnAndBed, name: 'Front yard', plantings: [...lawnAndBed.plantings.filter((p) => p.id !== 'barberry').map((p) => (p.id === 'oak' ? changes.plantings.upsert[0] : p)), changes.plantings.upsert[1]] }
    const whole = await client.post('/api/score', changed)
    expect(strip(mergeScoreUpdate(first.body, update.body, changed as never))).toEqual(strip(whole.body))
    expect(update.body.shares).toEqual(whole.body.shares)
    expect(update.body.moves).toEqual(whole.body.moves)

    // and a chain of changes goes on from each answer's basis
    const next = await client.post('/api/score', { basis: update.body.basis, changes: { plantings: { remove: ['asters'] } } })
    expect(next.status).toBe(200)
    expect(next.body.removedPlantings).toEqual(['asters'])
    // with the asters gone the lawn is whole again, as in the first answer
    const lawnLine = (score: { plantings: Array<{ id: string }> }) => score.plantings.find((p) => p.id === 'lawn')
    expect(next.body.plantings).toEqual([lawnLine(first.body)])
  })

  it('answers 409 to a basis the server does not hold, or holds for someone else', async () => {
    const mine = await newHomeowner('basis-owner')
    const { basis } = (await mine.client.post('/api/score', lawnAndBed)).body
    const other = await newHomeowner('basis-thief')
    const stolen = await other.client.post('/api/score', { basis, changes: {} })
    expect(stolen.status).toBe(409)
    expect(stolen.body.data.fields.basis).toBeTruthy()
    expect((await mine.client.post('/api/score', { basis: 'A'.repeat(24), changes: {} })).status).toBe(409)
  })

  it('refuses bad changes with a 400 naming the place in the request, and keeps the basis usable', async () => {
    const { client } = await newHomeowner('bad-changes')
    const { basis } = (await client.post('/api/score', lawnAndBed)).body
    const badCount = await client.post('/api/score', { basis, changes: { plantings: { upsert: [{ id: 'oak', species: 'Quercus alba', x: 1, y: 1, count: 0 }] } } })
    expect(badCount.status).toBe(400)
    expect(Object.keys(badCount.body.data.fields)).toEqual(['changes.plantings.upsert.0.count'])
    const missing = await client.post('/api/score', { basis, changes: { plantings: { remove: ['nothing-here'] } } })
    expect(missing.status).toBe(400)
    expect(Object.keys(missing.body.data.fields)).toEqual(['changes.plantings.remove.0'])
    const crossing = await client.post('/api/score', { basis, changes: { areas: { upsert: [{ id: 'bed', kind: 'bed', points: [[0, 0], [2, 2], [2, 0], [0, 2]] }] } } })
    expect(crossing.status).toBe(400)
    expect(Object.keys(crossing.body.data.fields)).toEqual(['changes.areas.upsert.0.points'])
    expect((await client.post('/api/score', { basis: 'short', changes: {} })).body.data.fields.basis).toBeTruthy()
    expect((await client.post('/api/score', { basis, changes: {} })).status).toBe(200)
  })
})

describe('GET /api/yards/[id]/score', () => {
  it('scores a saved yard as the posted document scores, for its viewers only', async () => {
    const owner = await newHomeowner('saved-score')
    const { id } = (await owner.client.post('/api/yards', { name: 'Scored', region: 'US-OH', document: lawnAndBed })).body
    const saved = await owner.client.get(`/api/yards/${id}/score`)
    expect(saved.status).toBe(200)
    const { basis: _basis, ...posted } = (await owner.client.post('/api/score', lawnAndBed)).body
    expect(saved.body).toEqual(posted)
    expect((await (await newHomeowner('stranger')).client.get(`/api/yards/${id}/score`)).status).toBe(404)
  })

  it('scores the demo yard shared with the advisor', async () => {
    const advisor = await demo('advisor')
    const shared = (await advisor.get('/api/yards')).body.items.find((y: { access: string }) => y.access === 'edit')
    const r = await advisor.get(`/api/yards/${shared.id}/score`)
    expect(r.status).toBe(200)
    expect(r.body.byStatus.invasive.count).toBeGreaterThan(0)
    expect(r.body.plantings.find((p: { id: string }) => p.id === 'coneflower')).toMatchObject({ status: 'native', cultivar: true })
  })
})


describe('POST /api/score body', () => {
  it('answers 400 to a body that is not JSON', async () => {
    const r = await (await demo('homeowner')).request('POST', '/api/score', '{"plantings": [', { 'content-type': 'application/json' })
    expect(r.status).toBe(400)
    expect(r.body.data.fields._).toMatch(/not valid JSON/)
  })
})
