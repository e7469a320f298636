// Species search over HTTP: one matching rule (case and accents folded, × read as x) and one ranking (the
// region's natives, then recorded there, then the rest). Names and statuses from USDA PLANTS via the catalogue.
import { describe, it, expect } from 'vitest'
import { Client } from '../../support/http'

const anon = new Client()
const search = async (q: string, region = 'US-OH', extra = '') => (await anon.get(`/api/species?region=${region}&q=${encodeURIComponent(q)}&pageSize=10${extra}`)).body

describe('matching', () => {
  it('finds an accented common name however the accent is typed', async () => {
    // USDA PLANTS: Triglochin gaspensis, "Gaspé Peninsula arrowgrass"
    for (const q of ['gaspe', 'Gaspé', 'GASPE PEN', 'gaspe\u0301']) {
      const r = await search(q)
      expect(r.items.map((i: any) => i.scientificName), q).toContain('Triglochin gaspensis')
    }
  })
  it('finds a hybrid by ×, by x and without the sign', async () => {
    // USDA PLANTS: Acer ×freemanii (Freeman maple), recorded and native in Ohio
    for (const q of ['Acer ×freemanii', 'acer x freemanii', 'Acer X freem', 'freemanii']) {
      const r = await search(q)
      expect(r.items[0]?.scientificName, q).toBe('Acer ×freemanii')
      expect(r.items[0]?.status).toBe('native')
    }
  })
  it('filters the sorted table by the same rule', async () => {
    const r = (await anon.get('/api/species?region=US-OH&q=gaspe&sort=name')).body
    expect(r.items.map((i: any) => i.scientificName)).toEqual(['Triglochin gaspensis'])
  })
})

describe('ranking', () => {
  it('puts Ohio natives first for "purple conef" and "milkweed" in Ohio', async () => {
    // USDA PLANTS: Echinacea purpurea L48(N) recorded in Ohio; E. pallida not recorded in Ohio
    expect((await search('purple conef')).items[0]).toMatchObject({ scientificName: 'Echinacea purpurea', status: 'native' })
    const milkweeds = (await search('milkweed')).items
    expect(milkweeds.map((i: any) => i.status)).toEqual(new Array(10).fill('native'))
  })
  it('orders natives, then recorded, then not recorded', async () => {
    const r = (await anon.get('/api/species?region=US-OH&q=aster&pageSize=200')).body
    const group = (s: string) => (s === 'native' ? 0 : s === 'absent' ? 2 : 1)
    const groups = r.items.map((i: any) => group(i.status))
    expect(groups).toEqual([...groups].sort((a, b) => a - b))
    expect(groups).toContain(0)
    expect(groups).toContain(2)
  })
  it('opens the species table on the region\'s natives', async () => {
    const r = (await anon.get('/api/species?region=US-OH&pageSize=50')).body
    expect(r.items.every((i: any) => i.status === 'native')).toBe(true)
  })
})
