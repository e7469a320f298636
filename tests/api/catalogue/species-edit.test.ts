// A coordinator edits one species in a form (PUT /api/species/[name]): the changed fields become the
// organization's values with their source; bad input is a 400 naming the field; others may not edit.
import { describe, it, expect, beforeAll } from 'vitest'
import { Client, demo } from '../../support/http'

const anon = new Client()
let coordinator: Client
beforeAll(async () => { coordinator = await demo('coordinator') })
const detail = async (name: string, region = 'US-OH') => (await anon.get(`/api/species/${encodeURIComponent(name)}?region=${region}`)).body

describe('editing one species', () => {
  it('changes the facts given, names the organization as their source, and leaves the rest', async () => {
    const before = await detail('Solidago speciosa')
    const r = await coordinator.put('/api/species/Solidago%20speciosa', { sun: ['full', 'part'], moisture: ['dry', 'medium'], height: 0.9, commonName: before.commonName, source: 'our regional list 2026' })
    expect(r.status).toBe(200)
    // the common name was sent unchanged, so it is not an override
    expect(r.body.changed.sort()).toEqual(['height', 'moisture', 'sun'])
    const after = await detail('Solidago speciosa')
    expect(after.sun).toEqual(['full', 'part'])
    expect(after.height).toBe(0.9)
    expect(after.sources.sun).toBe('our regional list 2026')
    expect(after.commonName).toBe(before.commonName)
    expect(after.soil).toEqual(before.soil)
    // and the fits now count its sun as recorded: a known fit for a sunny bed in Ohio, zone 6a
    const fits = await anon.get('/api/fits?region=US-OH&zone=6a&sun=full&moisture=dry&layer=ground&limit=200')
    const found = [...fits.body.items, ...fits.body.unrecorded].find((i: any) => i.scientificName === 'Solidago speciosa')
    expect(found?.sources.sun).toBe("your organization's list")
  })
  it('sets a status on the organization\'s regional list', async () => {
    const r = await coordinator.put('/api/species/Lonicera%20maackii', { region: 'US-OH', status: 'invasive', source: 'state invasive list' })
    expect(r.status).toBe(200)
    expect((await detail('Lonicera maackii')).status).toBe('invasive')
  })
  it('answers 400 naming each bad field, and keeps the catalogue as it was', async () => {
    const before = await detail('Zizia aurea')
    const r = await coordinator.put('/api/species/Zizia%20aurea', { height: -1, minZone: '14a', sun: ['bright'], status: 'native', source: '' })
    expect(r.status).toBe(400)
    for (const f of ['height', 'minZone', 'sun.0', 'source']) expect(Object.keys(r.body.data.fields).some((k) => k === f || k.startsWith(`${f}.`) || f.startsWith(k)), f).toBe(true)
    expect((await detail('Zizia aurea')).height).toBe(before.height)
  })
  it('404s a name not in the catalogue', async () => {
    expect((await coordinator.put('/api/species/Nonexistia%20imaginaria', { source: 'test' })).status).toBe(404)
  })
})
