// The catalogue build over the committed USDA reference extract (tests/fixtures/usda-extract, provenance in its
// README), and — when ../shared/data/usda-plants is present — a full cross-check of every committed catalogue row.
import { describe, it, expect } from 'vitest'
import { existsSync, readFileSync } from 'node:fs'
import { gunzipSync } from 'node:zlib'
import { join } from 'node:path'
import { buildCatalogueEntries, readUsdaCsv } from '../../../scripts/lib/catalogue-build'
import type { CatalogueEntry } from '#shared/utils/catalogue-rules'
import { REGIONS } from '#shared/utils/regions'

const ROOT = join(import.meta.dirname, '..', '..', '..')
const EXTRACT = join(ROOT, 'tests', 'fixtures', 'usda-extract')
const FULL = join(ROOT, '..', 'shared', 'data', 'usda-plants')

describe('catalogue build on the reference extract', () => {
  const { entries } = buildCatalogueEntries(EXTRACT)
  const byName = new Map(entries.map((e) => [e.scientificName, e]))
  const get = (n: string) => byName.get(n)!

  it('keeps every taxon with a characteristics row', () => {
    expect(entries.map((e) => e.scientificName).sort()).toEqual(['Amelanchier canadensis', 'Asclepias tuberosa', 'Berberis thunbergii', 'Lolium perenne', 'Poa pratensis'])
  })
  it('Asclepias tuberosa is native in US-OH', () => {
    // plant_distribution.csv.gz: ASTU recorded in Ohio; plant_native_status_codes.csv.gz: L48(N)CAN(N)
    expect(get('Asclepias tuberosa').regions['US-OH']).toBe('native')
    expect(get('Asclepias tuberosa').regions['CA-ON']).toBe('native')
  })
  it('Amelanchier canadensis is not native in US-OH (USDA does not record it in Ohio)', () => {
    // plant_distribution.csv.gz: AMCA4 has no Ohio row; it has Pennsylvania and New York rows
    expect(get('Amelanchier canadensis').regions['US-OH']).toBeUndefined()
    expect(get('Amelanchier canadensis').regions['US-PA']).toBe('native')
    expect(get('Amelanchier canadensis').layer).toBe('tree')
  })
  it('Poa pratensis is native and introduced', () => {
    // plant_native_status_codes.csv.gz: L48(I,N) … CAN(NI)
    expect(get('Poa pratensis').regions['US-OH']).toBe('nativeAndIntroduced')
    expect(get('Poa pratensis').regions['CA-ON']).toBe('nativeAndIntroduced')
    expect(get('Poa pratensis').lawn).toBe(true)
  })
  it('Berberis thunbergii is invasive in US-CT and US-MA, introduced elsewhere', () => {
    // noxious_composite_2015.csv.gz: "CT (INB), MA (P)"; plant_native_status_codes.csv.gz: L48(I)CAN(I)
    expect(get('Berberis thunbergii').regions['US-CT']).toBe('invasive')
    expect(get('Berberis thunbergii').regions['US-MA']).toBe('invasive')
    expect(get('Berberis thunbergii').regions['US-OH']).toBe('introduced')
    expect(get('Berberis thunbergii').noxiousIn).toEqual(['US-CT', 'US-MA'])
  })
  it('Lolium perenne is introduced', () => {
    // plant_native_status_codes.csv.gz: L48(I)AK(I)HI(I)PR(I)CAN(I)…
    expect(new Set(Object.values(get('Lolium perenne').regions))).toEqual(new Set(['introduced']))
  })
  it('zones come from temperature_minimum_f through the zone table', () => {
    // plant_characteristics.csv.gz: ASTU temperature_minimum_f −33 → 3b (USDA 2023 zone table)
    expect(get('Asclepias tuberosa').minTemperatureF).toBe(-33)
    expect(get('Asclepias tuberosa').minZone).toBe('3b')
  })
})

const usdaTrue = (v: string | undefined) => v === 'TRUE'

describe.skipIf(!existsSync(FULL))('full cross-check of the committed catalogue against ../shared/data/usda-plants', () => {
  const committed = JSON.parse(gunzipSync(readFileSync(join(ROOT, 'server', 'assets', 'catalogue', 'catalogue.json.gz'))).toString('utf8')) as { header: { version: string }; species: CatalogueEntry[] }

  it('the committed file is what the build makes from the data today', () => {
    const { entries } = buildCatalogueEntries(FULL)
    expect(entries.length).toBe(committed.species.length)
    // compare as text (fast), then show the first row that differs
    const differs = entries.findIndex((e, i) => JSON.stringify(e) !== JSON.stringify(committed.species[i]))
    if (differs >= 0) expect(committed.species[differs]).toEqual(entries[differs])
  }, 120_000)

  it('every row agrees with the raw files, checked independently of the rules module', () => {
    const plants = new Map(readUsdaCsv(FULL, 'plants').map((p) => [p.symbol!, p]))
    const chars = new Map(readUsdaCsv(FULL, 'plant_characteristics').map((c) => [c.symbol!, c]))
    const stateName = new Map(Object.entries(REGIONS).map(([code, name]) => [name, code]))
    // expect() per row is slow over 180,000 checks: collect the failures and compare once
    const failures: string[] = []
    const check = (ok: unknown, what: string) => { if (!ok) failures.push(what) }
    const recorded = new Map<string, Set<string>>()
    for (const d of readUsdaCsv(FULL, 'plant_distribution')) {
      const code = stateName.get(d.state!) ?? ({ Newfoundland: 'CA-NL', Labrador: 'CA-NL', 'Navassa Island': 'US-UM' } as Record<string, string>)[d.state!]
      check(code, `state ${d.state}`)
      if (!recorded.has(d.symbol!)) recorded.set(d.symbol!, new Set())
      recorded.get(d.symbol!)!.add(code!)
    }
    // native status codes keyed by bare name, "X" hybrid sign as the catalogue writes it
    const codes = new Map(readUsdaCsv(FULL, 'plant_native_status_codes').map((r) => [r.scientificName!.replace(/ X /g, ' ×').toLowerCase(), r.nativeStatus!]))
    const inCatalogue = new Set(committed.species.map((e) => e.symbol))
    for (const symbol of chars.keys()) check(inCatalogue.has(symbol), `characteristics taxon ${symbol}`)
    let checkedNative = 0
    for (const e of committed.species) {
      const p = plants.get(e.symbol)!
      check(p && p.scientific_name!.startsWith(e.scientificName.split(' ')[0]!), `plants row for ${e.symbol}`)
      const where = recorded.get(e.symbol) ?? new Set()
      const code = codes.get(e.scientificName.toLowerCase())
      for (const [region, status] of Object.entries(e.regions)) {
        // a status only where USDA records the taxon
        check(where.has(region), `${e.scientificName} recorded in ${region}`)
        const area = region.startsWith('CA-') ? 'CAN' : ({ 'US-AK': 'AK', 'US-HI': 'HI', 'US-PR': 'PR', 'US-VI': 'VI' } as Record<string, string>)[region] ?? (['US-GU', 'US-AS', 'US-MP', 'US-UM', 'US-PW', 'US-MH', 'US-FM'].includes(region) ? null : 'L48')
        if (status === 'native' && code && area) {
          // native needs an N (and no I) in that area's code
          const m = new RegExp(`${area}\\(([^)]*)\\)`).exec(code)
          check(m && /N/.test(m[1]!) && !/I/.test(m[1]!), `${e.scientificName} native in ${region} with ${code}`)
          checkedNative++
        }
        if (status === 'invasive') check(e.noxiousIn.includes(region), `${e.scientificName} invasive in ${region} but not listed`)
      }
      const c = chars.get(e.symbol)
      check(e.hasCharacteristics === !!c, `${e.scientificName} characteristics flag`)
      if (c && c.temperature_minimum_f) {
        // 2023 zone table: half-zones of 5 °F from −60 °F, lower bound inclusive
        const t = Number(c.temperature_minimum_f)
        const i = Math.max(0, Math.min(25, Math.floor((t + 60) / 5)))
        check(e.minZone === `${Math.floor(i / 2) + 1}${i % 2 ? 'b' : 'a'}`, `${e.scientificName} zone ${e.minZone} for ${t} °F`)
      } else if (e.minZone) {
        // no USDA minimum temperature: the zone is an estimate from a region where the taxon is native
        check(e.estimated.includes('minZone') && e.sources.minZone!.startsWith('estimated from its native range'), `${e.scientificName} estimated zone marked`)
        check(Object.values(e.regions).some((s) => s === 'native' || s === 'nativeAndIntroduced'), `${e.scientificName} estimated zone without a native region`)
      }
      if (c) {
        check(e.soil.includes('sand') === usdaTrue(c.adapted_to_coarse_textured_soils) && e.soil.includes('clay') === usdaTrue(c.adapted_to_fine_textured_soils), `${e.scientificName} soil`)
        // 1 ft = 0.3048 m exactly, rounded to the centimetre
        if (Number(c.height_mature_feet) > 0) check(Math.abs(e.height - Number(c.height_mature_feet) * 0.3048) < 0.006, `${e.scientificName} height`)
      }
      check(e.spread > 0 && e.estimated.includes('spread'), `${e.scientificName} spread`)
    }
    expect(failures.slice(0, 20)).toEqual([])
    expect(checkedNative).toBeGreaterThan(100_000)
  }, 120_000)
})
