// Input the schemas accept must never reach the database as something it refuses: impossible dates, broken
// Unicode, text longer than its column. Each is a 400 naming the field (or fits), never a 500.
import { describe, it, expect } from 'vitest'
import { newHomeowner, demo } from '../../support/http'
import { visitTo, yardWith, testYardDocument, farFutureDates } from '../advice/fixtures'

describe('input the database would refuse', () => {
  it('impossible dates on visits and drives are a 400 naming the field', async () => {
    const { client } = await newHomeowner('dates')
    const v = await visitTo(client)
    for (const visitedOn of ['2026-02-30', '9999-99-99', '2025-02-29']) {
      const r = await v.advisor.post(`/api/advice-requests/${v.requestId}/visits`, { visitedOn, notes: '' })
      expect(r.status, visitedOn).toBe(400)
      expect(Object.keys(r.body.data.fields)).toEqual(['visitedOn'])
    }
    const coordinator = await demo('coordinator')
    const { startsOn } = farFutureDates()
    const r = await coordinator.post('/api/drives', { name: 'Impossible', startsOn, endsOn: '2199-04-31', target: 10 })
    expect(r.status).toBe(400)
    expect(r.body.data.fields).toHaveProperty('endsOn')
  })

  it('a lone UTF-16 surrogate in a string is a 400 naming the field', async () => {
    const { client } = await newHomeowner('surrogate')
    // JSON.stringify writes a lone surrogate as the escape \ud800 (well-formed JSON, ill-formed text)
    const body = `{"name":"Yard ${'\\ud800'}","region":"US-OH"}`
    const r = await client.request('POST', '/api/yards', body, { 'content-type': 'application/json' })
    expect(r.status).toBe(400)
    expect(Object.keys(r.body.data.fields)).toEqual(['name'])
    const doc = testYardDocument()
    doc.areas[0]!.label = 'Bed \ud83d'
    const r2 = await client.post('/api/yards', { name: 'Surrogate in a label', region: 'US-OH', document: doc })
    expect(r2.status).toBe(400)
    expect(Object.keys(r2.body.data.fields)).toEqual(['document.areas.0.label'])
    // a proper pair (an emoji) is fine
    expect((await client.post('/api/yards', { name: 'Bees \ud83d\udc1d', region: 'US-OH' })).status).toBe(201)
  })

  it('a recommendation whose summary would be longer than its column is kept, cut to fit', async () => {
    const { client } = await newHomeowner('long-summary')
    const doc = testYardDocument()
    doc.areas[0]!.label = 'A bed with a very long name '.repeat(7).slice(0, 200)
    const yardId = await yardWith(client)
    const saved = await client.get(`/api/yards/${yardId}`)
    expect((await client.put(`/api/yards/${yardId}`, { version: saved.body.version, document: doc })).status).toBe(200)
    const v = await visitTo(client, { yardId })
    const change = { kind: 'add', bedId: 'bed', species: 'Asclepias tuberosa', cultivar: 'C'.repeat(120), count: 5, spread: 0.45, height: 0.6 }
    const r = await v.advisor.post(`/api/visits/${v.visitId}/recommendations`, { change })
    expect(r.status).toBe(201)
    expect(r.body.summary.length).toBeLessThanOrEqual(400)
  })
})
