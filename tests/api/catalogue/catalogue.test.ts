// The species catalogue over HTTP: table, species page, fits, swaps, CSV import (all-or-nothing) and export.
// Statuses named here come from the USDA PLANTS files (plant_distribution, plant_native_status_codes,
// noxious_composite_2015) through the committed catalogue.
import { describe, it, expect, beforeAll } from 'vitest'
import { Client, demo, newHomeowner } from '../../support/http'
import { zoneIndex } from '#shared/utils/catalogue-rules'

const anon = new Client()
let coordinator: Client
beforeAll(async () => { coordinator = await demo('coordinator') })

const detail = async (name: string, region: string) => (await anon.get(`/api/species/${encodeURIComponent(name)}?region=${region}`)).body

describe('species table', () => {
  it('finds a species by common name with its status in the region', async () => {
    const r = await anon.get('/api/species?region=US-OH&q=butterfly%20milkweed')
    expect(r.status).toBe(200)
    const item = r.body.items.find((i: any) => i.scientificName === 'Asclepias tuberosa')
    // plant_distribution.csv.gz records ASTU in Ohio; native status L48(N)
    expect(item).toMatchObject({ commonName: 'butterfly milkweed', layer: 'ground', status: 'native', minZone: '3b' })
    expect(item.estimated).toContain('spread')
    expect(r.body.total).toBeGreaterThanOrEqual(1)
  })
  it('filters by status and layer, sorts and pages on the server', async () => {
    const r = await anon.get('/api/species?region=US-CT&status=invasive&layer=shrub&pageSize=200')
    // noxious_composite_2015.csv.gz lists Berberis thunbergii in CT
    expect(r.body.items.map((i: any) => i.scientificName)).toContain('Berberis thunbergii')
    expect(r.body.items.every((i: any) => i.status === 'invasive' && i.layer === 'shrub')).toBe(true)
    const p1 = await anon.get('/api/species?region=US-OH&layer=tree&sort=height&dir=desc&page=1&pageSize=20')
    const p2 = await anon.get('/api/species?region=US-OH&layer=tree&sort=height&dir=desc&page=2&pageSize=20')
    expect(p1.body.total).toBe(p2.body.total)
    const heights = [...p1.body.items, ...p2.body.items].map((i: any) => i.height)
    expect(heights).toEqual([...heights].sort((a, b) => b - a))
    expect(new Set([...p1.body.items, ...p2.body.items].map((i: any) => i.scientificName)).size).toBe(40)
  })
  it('rejects a status filter without a region', async () => {
    const r = await anon.get('/api/species?status=native')
    expect(r.status).toBe(400)
    expect(r.body.data.fields.status).toBeTruthy()
  })
})

describe('species page', () => {
  it('gives sources, where native, and absent where USDA does not record it', async () => {
    const d = await detail('Amelanchier canadensis', 'US-OH')
    // plant_distribution.csv.gz: AMCA4 recorded in Pennsylvania, not Ohio
    expect(d.status).toBe('absent')
    expect(d.nativeIn).toContain('US-PA')
    expect(d.nativeIn).not.toContain('US-OH')
    expect(d.sources.height).toBe('USDA PLANTS')
    expect(d.sources.spread).toMatch(/^estimated/)
    expect(d.estimatedFields).toContain('spread')
  })
  it('Poa pratensis is native and introduced; Lolium perenne introduced', async () => {
    expect((await detail('Poa pratensis', 'US-OH')).status).toBe('nativeAndIntroduced')
    expect((await detail('Lolium perenne', 'US-OH')).status).toBe('introduced')
  })
  it('keeps the coordinator\'s regional list apart from USDA: the demo list marks barberry invasive in US-OH', async () => {
    const d = await detail('Berberis thunbergii', 'US-OH')
    // demo data (server/services/catalogue.ts DEMO_REGIONAL_LIST); USDA alone says introduced in Ohio
    expect(d.status).toBe('invasive')
    expect(d.regions.find((r: any) => r.region === 'US-OH').source).toMatch(/coordinator/)
    expect(d.overrides).toEqual(expect.arrayContaining([expect.objectContaining({ region: 'US-OH', field: 'status', value: 'invasive' })]))
    // noxious_composite_2015.csv.gz: CT and MA list it
    expect((await detail('Berberis thunbergii', 'US-CT')).regions.find((r: any) => r.region === 'US-CT')).toMatchObject({ status: 'invasive', source: 'USDA PLANTS' })
  })
  it('404s an unknown name', async () => {
    expect((await anon.get('/api/species/Nonexistia%20imaginaria')).status).toBe(404)
  })
})

describe('good fits', () => {
  const cases = [
    'region=US-OH&zone=6a&sun=part&soil=clay&moisture=wet&layer=shrub&maxSpread=2',
    'region=US-OH&zone=5b&sun=full&soil=sand&moisture=dry',
    'region=CA-ON&zone=4a&sun=shade&layer=ground',
    'region=US-TX&zone=8b&layer=tree',
  ]
  for (const q of cases) {
    it(`never returns a non-native or non-hardy species (${q})`, async () => {
      const r = await anon.get(`/api/fits?${q}&limit=200`)
      expect(r.status).toBe(200)
      expect(r.body.items.length).toBeGreaterThan(0)
      const params = new URLSearchParams(q)
      const zone = zoneIndex(params.get('zone'))!
      for (const item of r.body.items) {
        expect(item.status).toBe('native')
        expect(zoneIndex(item.minZone)).not.toBeNull()
        expect(zoneIndex(item.minZone)!).toBeLessThanOrEqual(zone)
        if (params.get('sun')) expect(item.sun).toContain(params.get('sun'))
        if (params.get('layer')) expect(item.layer).toBe(params.get('layer'))
        if (params.get('maxSpread')) expect(item.spread).toBeLessThanOrEqual(Number(params.get('maxSpread')))
        expect(item.fit).toBe('known')
        expect(item.reasons.length + r.body.shared.length).toBeGreaterThan(0)
      }
      for (const item of r.body.unrecorded) {
        expect(item.status).toBe('native')
        expect(item.reasons.join(' ')).toMatch(/Site needs not recorded — check your regional list/)
      }
      const scores = r.body.items.map((i: any) => i.score)
      expect(scores).toEqual([...scores].sort((a: number, b: number) => b - a))
      // the species page agrees with the fit on status (independent route and query)
      for (const item of r.body.items.slice(0, 5)) expect((await detail(item.scientificName, params.get('region')!)).status).toBe('native')
    })
  }
  it('uses a yard\'s plantings for bloom and layer gaps', async () => {
    const { client } = await newHomeowner('fits')
    const doc = { boundary: [[0, 0], [10, 0], [10, 10], [0, 10]], plantings: [{ id: 'a', species: 'Asclepias tuberosa', x: 1, y: 1, count: 3 }] }
    const yard = (await client.post('/api/yards', { name: 'Fits yard', region: 'US-OH', document: doc })).body
    const r = await client.get(`/api/fits?yardId=${yard.id}&zone=6a&sun=full&limit=100`)
    expect(r.status).toBe(200)
    const reasons = [...r.body.shared, ...r.body.items.flatMap((i: any) => i.reasons)].join(' | ')
    expect(reasons).toMatch(/when nothing native in your yard does/)
    expect(reasons).toMatch(/layer your yard lacks/)
    // the yard's only native blooms in July (USDA bloom_period Mid Summer): no fit claims to fill July
    expect(reasons).not.toMatch(/Blooms in [^|]*July[^|]*when nothing/)
  })
})

describe('fits keep natives without USDA traits (US-OH, zone 6a)', () => {
  it('reaches at least 1,500 Ohio natives across the bed settings, paging both groups', { timeout: 120_000 }, async () => {
    const reached = new Set<string>()
    for (const sun of ['full', 'part', 'shade']) for (const moisture of ['dry', 'medium', 'wet']) {
      for (let page = 1; page < 50; page++) {
        const r = await anon.get(`/api/fits?region=US-OH&zone=6a&sun=${sun}&moisture=${moisture}&limit=200&page=${page}`)
        expect(r.status).toBe(200)
        for (const i of [...r.body.items, ...r.body.unrecorded]) reached.add(i.scientificName)
        if (r.body.items.length < 200 && r.body.unrecorded.length < 200) break
      }
    }
    // USDA PLANTS: 2,205 taxa native in Ohio; 669 have a minimum temperature
    expect(reached.size).toBeGreaterThanOrEqual(1500)
  })
  it('gives a demo yard\'s bed suggestions from both groups, the unrecorded ones saying so', async () => {
    const homeowner = await demo('homeowner')
    const yards = (await homeowner.get('/api/yards')).body
    const list = Array.isArray(yards) ? yards : yards.items
    expect(list.length).toBeGreaterThan(0)
    let beds = 0
    for (const y of list) {
      const yard = (await homeowner.get(`/api/yards/${y.id}`)).body
      // each bed as the editor's fits panel asks for it: its sun, soil and moisture, and its narrower side as room
      for (const bed of yard.document.areas.filter((a: any) => a.kind === 'bed')) {
        const xs = bed.points.map((p: number[]) => p[0])
        const ys = bed.points.map((p: number[]) => p[1])
        const room = Math.min(Math.max(...xs) - Math.min(...xs), Math.max(...ys) - Math.min(...ys))
        const cond = Object.entries({ sun: bed.sun, soil: bed.soil, moisture: bed.moisture }).filter(([, v]) => v).map(([k, v]) => `&${k}=${v}`).join('')
        const r = await homeowner.get(`/api/fits?yardId=${y.id}${cond}&maxSpread=${room.toFixed(2)}&limit=8`)
        expect(r.status).toBe(200)
        expect(r.body.items.length, bed.label).toBeGreaterThan(0)
        expect(r.body.unrecorded.length, bed.label).toBeGreaterThan(0)
        for (const i of r.body.unrecorded) {
          expect(i.fit).toBe('unrecorded')
          expect(i.reasons.some((x: string) => x.startsWith('Site needs not recorded — check your regional list')), i.scientificName).toBe(true)
        }
        beds++
      }
    }
    expect(beds).toBeGreaterThan(0)
  })
  it('names the source of each fact and gives a score out of 100', async () => {
    const r = await anon.get('/api/fits?region=US-OH&zone=6a&layer=ground&limit=200')
    const all = [...r.body.items, ...r.body.unrecorded]
    for (const i of all) {
      expect(i.score).toBeGreaterThanOrEqual(0)
      expect(i.score).toBeLessThanOrEqual(100)
      expect(['USDA PLANTS', 'estimated', 'estimated from its native range', "your organization's list"]).toContain(i.sources.height)
    }
    // New England aster: no USDA minimum temperature; native from Minnesota east, so estimated from its range
    const aster = await detail('Symphyotrichum novae-angliae', 'US-OH')
    expect(aster.minZone).not.toBeNull()
    expect(aster.sources.minZone).toMatch(/^estimated from its native range/)
  })
  it('rejects a zone outside the USDA 2023 map\'s 1a–13b, naming the field', async () => {
    for (const z of ['0a', '14a', '6c', 'zone 6']) {
      const r = await anon.get(`/api/fits?region=US-OH&zone=${encodeURIComponent(z)}`)
      expect(r.status, z).toBe(400)
      expect(r.body.data.fields.zone).toMatch(/USDA/)
    }
    expect((await anon.get('/api/fits?region=US-OH&zone=13b')).status).toBe(200)
    expect((await anon.get('/api/fits?region=US-OH&zone=1a')).status).toBe(200)
  })
})

describe('swaps', () => {
  it('offers native shrubs of similar size for Japanese barberry', async () => {
    const r = await anon.get('/api/swaps?region=US-OH&zone=6a&species=Berberis%20thunbergii&sun=full')
    expect(r.status).toBe(200)
    // introduced per USDA; the demo regional list makes it invasive in US-OH
    expect(r.body.species.status).toBe('invasive')
    const h0 = r.body.species.height
    expect(r.body.items.length).toBeGreaterThan(0)
    for (const i of r.body.items) {
      expect(i).toMatchObject({ layer: 'shrub', status: 'native' })
      expect(i.height).toBeGreaterThanOrEqual(h0 / 2)
      expect(i.height).toBeLessThanOrEqual(h0 * 2)
      expect(zoneIndex(i.minZone)!).toBeLessThanOrEqual(zoneIndex('6a')!)
    }
  })
  it('has nothing to swap for a native', async () => {
    const r = await anon.get('/api/swaps?region=US-OH&species=Asclepias%20tuberosa')
    expect(r.body.items).toEqual([])
  })
})

describe('coordinator CSV import and export', () => {
  const post = (path: string, body: string | Uint8Array, type = 'text/csv') => coordinator.request('POST', path, body, { 'content-type': type })

  it('previews row-level errors without writing, and a file with any bad row changes nothing', async () => {
    const before = await detail('Zizia aurea', 'US-OH')
    const csv = [
      'scientificName,region,status,spread,layer,coldMoistDays',
      'Zizia aurea,,,0.9,,',
      'Zizia aurea,US-OH,bogus,,,',
      'Testia wildwardensis,,,0.5,,',
      'Echinacea purpurea,,,,,400',
    ].join('\n')
    const preview = await post('/api/catalogue/import/preview', csv)
    expect(preview.status).toBe(200)
    const errs = preview.body.errors.map((e: any) => `${e.row}:${e.column}`)
    expect(errs).toEqual(expect.arrayContaining(['3:status', '4:layer', '5:coldMoistDays']))
    const apply = await post('/api/catalogue/import/apply', csv)
    expect(apply.status).toBe(400)
    expect(apply.body.data.errorCount).toBe(preview.body.errorCount)
    const after = await detail('Zizia aurea', 'US-OH')
    expect(after.spread).toBe(before.spread)
    expect(after.sources.spread).toBe(before.sources.spread)
    expect((await anon.get('/api/species/Testia%20wildwardensis')).status).toBe(404)
  })

  it('applies a clean file in one go: facts, a regional status, a new species', async () => {
    const csv = 'scientificName,region,status,spread,layer,commonName,source\nZizia aurea,,,3 ft,,,\nZizia aurea,US-AK,native,,,,coordinator\nTestia wildwardensis,US-OH,native,0.5,ground,test plant,from memory\n'
    // the table, search and fits answer from a per-instance copy with cached orders and answers: ask first so they are warm
    const table = '/api/species?region=US-OH&status=native&layer=ground&sort=spread&pageSize=200'
    const tableBefore = (await anon.get(table)).body.total
    expect((await anon.get('/api/species?region=US-OH&q=wildwardensis')).body.total).toBe(0)
    const preview = await post('/api/catalogue/import/preview', csv)
    expect(preview.body.errors).toEqual([])
    expect(preview.body.newSpecies).toEqual(['Testia wildwardensis'])
    const apply = await post('/api/catalogue/import/apply', csv)
    expect(apply.status).toBe(200)
    // the instance that applied the file answers from the new catalogue at once (the stamp row moved)
    expect((await anon.get(table)).body.total).toBe(tableBefore + 1)
    expect((await anon.get('/api/species?region=US-OH&q=wildwardensis')).body.items).toEqual([expect.objectContaining({ scientificName: 'Testia wildwardensis', status: 'native', spread: 0.5 })])
    expect((await anon.get('/api/species?region=US-AK&q=zizia%20aurea')).body.items.find((i: any) => i.scientificName === 'Zizia aurea')).toMatchObject({ status: 'native', spread: 0.91 })
    const z = await detail('Zizia aurea', 'US-AK')
    // 3 ft × 0.3048 m/ft = 0.91 m (to the centimetre); spacing follows an estimated default from the spread
    expect(z.spread).toBe(0.91)
    expect(z.sources.spread).toBe('coordinator')
    expect(z.estimatedFields).not.toContain('spread')
    expect(z.status).toBe('native')
    const t = await detail('Testia wildwardensis', 'US-OH')
    expect(t).toMatchObject({ status: 'native', layer: 'ground', origin: 'coordinator', commonName: 'test plant' })
    expect(t.sources.commonName).toBe('from memory')
    // the same file again changes nothing
    expect((await post('/api/catalogue/import/preview', csv)).body.changeCount).toBe(0)
  })

  it('checks the upload: type, size and content', async () => {
    expect((await post('/api/catalogue/import/preview', '{"a":1}', 'application/json')).status).toBe(415)
    expect((await post('/api/catalogue/import/preview', new Uint8Array([0x50, 0x4b, 0x03, 0x04, 0, 0, 0xff, 0xfe]))).status).toBe(400)
    expect((await post('/api/catalogue/import/preview', 'a'.repeat(5 * 1024 * 1024 + 10))).status).toBe(413)
    const noHeader = await post('/api/catalogue/import/preview', 'name,spread\nx,1\n')
    expect(noHeader.body.errors[0]).toMatchObject({ row: 1, column: 'scientificName' })
  })

  it('exports CSV that imports back with no changes', async () => {
    const r = await coordinator.get('/api/catalogue/export?region=US-OH&q=asclepias')
    expect(r.status).toBe(200)
    expect(r.headers.get('content-type')).toMatch(/text\/csv/)
    const text = r.body as string
    expect(text.split('\n')[0]).toMatch(/^scientificName,region,status,commonName,layer/)
    expect(text).toMatch(/Asclepias tuberosa,US-OH,native,butterfly milkweed,ground/)
    const back = await post('/api/catalogue/import/preview', text)
    expect(back.body.errors).toEqual([])
    expect(back.body.changeCount).toBe(0)
  })
})
