import { describe, it, expect } from 'vitest'
import { newHomeowner, demo } from '../../support/http'

describe('yards API', () => {
  it('creates, reads, renames with a version, and deletes a yard', async () => {
    const { client } = await newHomeowner('yards')
    const created = await client.post('/api/yards', { name: 'Test plot', region: 'US-OH' })
    expect(created.status).toBe(201)
    const { id, version } = created.body
    expect(version).toBe(1)
    const got = await client.get(`/api/yards/${id}`)
    expect(got.body).toMatchObject({ id, name: 'Test plot', region: 'US-OH', version: 1 })
    expect(got.body.document).toMatchObject({ format: 'wildward.yard/2', boundary: [], areas: [], plantings: [] })
    const renamed = await client.put(`/api/yards/${id}`, { version: 1, name: 'Renamed plot' })
    expect(renamed.status).toBe(200)
    expect(renamed.body.version).toBe(2)
    expect((await client.get('/api/yards')).body.items.map((y: { name: string }) => y.name)).toContain('Renamed plot')
    expect((await client.delete(`/api/yards/${id}`)).status).toBe(204)
    expect((await client.get(`/api/yards/${id}`)).status).toBe(404)
  })

  it('answers 409 with the current version to a stale save, and keeps the newer data', async () => {
    const { client } = await newHomeowner('stale')
    const { id } = (await client.post('/api/yards', { name: 'Race', region: 'US-OH' })).body
    expect((await client.put(`/api/yards/${id}`, { version: 1, name: 'First' })).status).toBe(200)
    const stale = await client.put(`/api/yards/${id}`, { version: 1, name: 'Second' })
    expect(stale.status).toBe(409)
    expect(stale.body.data.currentVersion).toBe(2)
    expect((await client.get(`/api/yards/${id}`)).body.name).toBe('First')
  })

  it('names the bad field in a 400 and stores nothing', async () => {
    const { client } = await newHomeowner('bad')
    const r = await client.post('/api/yards', { name: '', region: 'Ohio' })
    expect(r.status).toBe(400)
    expect(Object.keys(r.body.data.fields).sort()).toEqual(['name', 'region'])
    const { id } = (await client.post('/api/yards', { name: 'Good', region: 'US-OH' })).body
    const bowtie = { boundary: [[0, 0], [10, 10], [10, 0], [0, 10]], areas: [], plantings: [] }
    const bad = await client.put(`/api/yards/${id}`, { version: 1, document: bowtie })
    expect(bad.status).toBe(400)
    expect(bad.body.data.fields['document.boundary']).toMatch(/crosses itself/)
    expect((await client.get(`/api/yards/${id}`)).body.version).toBe(1)
    expect((await client.get('/api/yards')).body.items).toHaveLength(1)
  })

  it("never shows another user's yard", async () => {
    const a = await newHomeowner('a')
    const b = await newHomeowner('b')
    const { id } = (await a.client.post('/api/yards', { name: 'Private', region: 'US-OH' })).body
    const r = await b.client.get(`/api/yards/${id}`)
    expect(r.status).toBe(404)
    expect(JSON.stringify(r.body)).not.toContain('Private')
    expect((await b.client.get('/api/yards')).body.items).toEqual([])
    expect((await b.client.get('/api/yards/not-a-number')).status).toBe(404)
  })

  it('shows the demo yards to their owner and the shared one to the advisor', async () => {
    const owner = await demo('homeowner')
    const advisor = await demo('advisor')
    const mine = (await owner.get('/api/yards')).body.items
    expect(mine.length).toBeGreaterThanOrEqual(2)
    const shared = (await advisor.get('/api/yards')).body.items
    expect(shared.map((y: { access: string }) => y.access)).toContain('edit')
  })
})
