// The species table and search over the committed catalogue (server/assets/catalogue/catalogue.json.gz, derived
// from USDA PLANTS): precomputed sort orders give what sorting everything gives, and search ranks the region's
// natives first, then what is recorded there, then the rest, by the one matching rule.
import { describe, it, expect } from 'vitest'
import { readFileSync } from 'node:fs'
import { gunzipSync } from 'node:zlib'
import { join } from 'node:path'
import {
  buildSearchIndex, buildTableIndex, namedMask, nameHits, searchPage, tablePage, type CachedSpecies, type SpeciesTableQuery, type TableSort,
} from '../../../../server/services/catalogue-index'
import { zoneIndex, type CatalogueEntry } from '#shared/utils/catalogue-rules'
import { nameKey } from '#shared/utils/species-name'
import type { Layer, RegionStatus } from '#shared/types/species'

const ROOT = join(import.meta.dirname, '..', '..', '..', '..')
const file = JSON.parse(gunzipSync(readFileSync(join(ROOT, 'server', 'assets', 'catalogue', 'catalogue.json.gz'))).toString('utf8')) as { species: CatalogueEntry[] }
export const list: CachedSpecies[] = file.species.map(({ regions: _, ...data }, i) => ({ id: i + 1, origin: 'usda', minZoneIndex: zoneIndex(data.minZone), key: nameKey(data.scientificName), data }))
const statusMaps = new Map<string, Map<number, RegionStatus>>()
export function statusesOf(region?: string) {
  let m = statusMaps.get(region ?? '')
  if (!m) statusMaps.set(region ?? '', m = new Map(region ? file.species.flatMap((e, i) => (e.regions[region] ? [[i + 1, e.regions[region]!] as const] : [])) : []))
  return m
}

// independent of the code's collator: a plain locale comparison folding case and accents
function denseRanks(values: (string | null)[]): number[] {
  const cmp = (a: string, b: string) => a.localeCompare(b, 'en-US', { sensitivity: 'base', numeric: true })
  const order = values.map((_, i) => i).sort((a, b) => (values[a] === null ? -1 : 0) - (values[b] === null ? -1 : 0) || cmp(values[a] ?? '', values[b] ?? ''))
  const ranks = new Array<number>(values.length)
  let rank = 0
  order.forEach((i, k) => {
    const prev = k ? order[k - 1]! : -1
    if (k === 0 || (values[i] === null) !== (values[prev] === null) || cmp(values[i] ?? '', values[prev] ?? '') !== 0) rank++
    ranks[i] = rank
  })
  return ranks
}
const nameRank = denseRanks(list.map((s) => s.data.scientificName))
const commonRank = denseRanks(list.map((s) => s.data.commonName))

// the straightforward table: filters and key lists over every species
const STATUS_WORDS = ['native', 'nativeAndIntroduced', 'introduced', 'invasive', 'absent']
const GROUP: Record<string, number> = { native: 0, nativeAndIntroduced: 1, introduced: 1, invasive: 1, absent: 2 }
const LAYER_ENUM: Layer[] = ['tree', 'shrub', 'ground']
function plainTable(q: SpeciesTableQuery, named?: (s: CachedSpecies) => boolean) {
  const statuses = statusesOf(q.region)
  const status = (i: number) => statuses.get(list[i]!.id) ?? 'absent'
  const rows = list.map((_, i) => i).filter((i) => {
    const d = list[i]!.data
    return (!named || named(list[i]!)) && (!q.layer || d.layer === q.layer) && (!q.sun || d.sun.join(',').split(',').includes(q.sun)) && (!q.moisture || d.moisture.includes(q.moisture))
      && (!q.soil || d.soil.includes(q.soil)) && (!q.hasFacts || d.hasCharacteristics) && (!q.status || status(i) === q.status)
  })
  const dir = q.dir === 'desc' ? -1 : 1
  const keys: Record<TableSort, (i: number) => [number, number][]> = {
    relevance: (i) => [[GROUP[status(i)]!, 1], [list[i]!.data.hasCharacteristics ? 0 : 1, 1], [nameRank[i]!, 1]],
    name: (i) => [[nameRank[i]!, dir]],
    common: (i) => [[list[i]!.data.commonName === null ? 1 : 0, 1], [commonRank[i]!, dir], [nameRank[i]!, 1]],
    layer: (i) => [[LAYER_ENUM.indexOf(list[i]!.data.layer), dir], [nameRank[i]!, 1]],
    height: (i) => [[list[i]!.data.height, dir], [nameRank[i]!, 1]],
    spread: (i) => [[list[i]!.data.spread, dir], [nameRank[i]!, 1]],
    minZone: (i) => [[list[i]!.minZoneIndex === null ? 1 : 0, 1], [list[i]!.minZoneIndex ?? 0, dir], [nameRank[i]!, 1]],
    status: (i) => [[STATUS_WORDS.indexOf(status(i)), dir], [nameRank[i]!, 1]],
  }
  const keyed = new Map(rows.map((i) => [i, keys[q.sort ?? 'relevance'](i)]))
  rows.sort((a, b) => {
    const ka = keyed.get(a)!
    const kb = keyed.get(b)!
    for (let k = 0; k < ka.length; k++) if (ka[k]![0] !== kb[k]![0]) return (ka[k]![0] - kb[k]![0]) * ka[k]![1]
    return 0
  })
  const page = q.page ?? 1
  const size = q.pageSize ?? 50
  return { names: rows.slice((page - 1) * size, page * size).map((i) => list[i]!.data.scientificName), total: rows.length, statuses: rows.slice((page - 1) * size, page * size).map((i) => (q.region ? status(i) : null)) }
}

describe('species table from precomputed sort orders', () => {
  const table = buildTableIndex(list)
  const sorts: TableSort[] = ['name', 'common', 'layer', 'height', 'spread', 'minZone', 'status', 'relevance']
  const filters: Partial<SpeciesTableQuery>[] = [{}, { hasFacts: true }, { layer: 'shrub', sun: 'part' }, { status: 'native' }, { status: 'absent', soil: 'clay', moisture: 'wet' }]
  for (const region of ['US-OH', 'CA-ON', undefined]) {
    it(`agrees with filtering and sorting everything (${region ?? 'no region'})`, { timeout: 120_000 }, () => {
      const statuses = statusesOf(region)
      for (const sort of sorts) for (const dir of ['asc', 'desc'] as const) for (const f of filters) for (const page of [1, 4]) {
        if (f.status && !region) continue
        const q: SpeciesTableQuery = { region, sort, dir, page, pageSize: 25, ...f }
        const got = tablePage(table, q, statuses)
        const want = plainTable(q)
        expect({ names: got.items.map((i) => i.scientificName), total: got.total, statuses: got.items.map((i) => i.status) }, JSON.stringify(q)).toEqual(want)
      }
    })
  }
  it('pages past the end to an empty page with the total', () => {
    const statuses = statusesOf('US-OH')
    const q: SpeciesTableQuery = { region: 'US-OH', hasFacts: true, sort: 'name', page: 10_000 }
    const r = tablePage(table, q, statuses)
    expect(r.items).toEqual([])
    expect(r.total).toBe(plainTable(q).total)
  })
  it('opens (best match, no term) on the region\'s natives: in Ohio the first page is all Ohio natives', () => {
    const r = tablePage(table, { region: 'US-OH', page: 1, pageSize: 50 }, statusesOf('US-OH'))
    expect(r.items.map((i) => i.status)).toEqual(new Array(50).fill('native'))
  })
  it('gives the table row fields of a species', () => {
    const s = list.find((x) => x.data.scientificName === 'Asclepias tuberosa')!
    const all = [] as ReturnType<typeof tablePage>['items']
    for (let page = 1; ; page++) {
      const p = tablePage(table, { region: 'US-OH', layer: 'ground', pageSize: 200, page }, statusesOf('US-OH'))
      all.push(...p.items)
      if (p.items.length < 200) break
    }
    // plant_distribution.csv.gz records ASTU in Ohio; native status L48(N)
    expect(all.find((i) => i.scientificName === 'Asclepias tuberosa')).toMatchObject({ status: 'native', layer: 'ground', minZone: s.data.minZone, spacing: s.data.spacing, estimated: s.data.estimated })
  })
})

describe('search as you type', () => {
  const table = buildTableIndex(list)
  const search = buildSearchIndex(table)
  const oh = statusesOf('US-OH')
  const first = (q: string, region = 'US-OH') => searchPage(search, { q, region, page: 1, pageSize: 10 }, statusesOf(region)).items
  it('puts an Ohio native first for "purple conef", "purple coneflower" and "milkweed" in Ohio', () => {
    // USDA PLANTS: Echinacea purpurea (eastern purple coneflower) L48(N), recorded in Ohio; E. pallida is not recorded there
    expect(first('purple conef')[0]).toMatchObject({ scientificName: 'Echinacea purpurea', status: 'native' })
    expect(first('purple coneflower')[0]).toMatchObject({ scientificName: 'Echinacea purpurea', status: 'native' })
    // Ohio has at least ten native milkweeds (Asclepias syriaca, incarnata, tuberosa, exaltata, …): the whole first page
    expect(first('milkweed').map((i) => i.status)).toEqual(new Array(10).fill('native'))
  })
  it('ranks natives, then recorded, then the rest, and by how well the name matches within each', { timeout: 60_000 }, () => {
    const group = (s: string | null) => GROUP[s ?? 'absent']!
    for (const q of ['milk', 'oak', 'aster', 'quercus', 'grass', 'a']) {
      const r = searchPage(search, { q, region: 'US-OH', page: 1, pageSize: 200 }, oh)
      const groups = r.items.map((i) => group(i.status))
      expect(groups, q).toEqual([...groups].sort((a, b) => a - b))
      // within the natives, a name that starts with the term comes before one that only contains it inside a word
      const natives = r.items.filter((i) => i.status === 'native')
      const starts = natives.map((i) => [i.scientificName, i.commonName ?? ''].some((n) => n.toLowerCase().startsWith(q)))
      const lastStart = starts.lastIndexOf(true)
      const firstInside = natives.findIndex((i) => [i.scientificName, i.commonName ?? ''].every((n) => !n.toLowerCase().split(/[\s-]/).some((w) => w.startsWith(q))))
      if (lastStart >= 0 && firstInside >= 0) expect(lastStart, q).toBeLessThan(firstInside)
    }
  })
  it('finds every name containing the term, folded for case and accents, and nothing else', { timeout: 60_000 }, () => {
    const fold = (t: string) => t.normalize('NFD').replace(/[\u0300-\u036f]/g, '').toLowerCase().replace(/\s*×\s*/g, ' x ').trim()
    for (const q of ['milk', 'ASCLEP', 'gaspe', 'Gaspé', 'pe', "'s", 'zzzz', 'acer x']) {
      const want = list.filter((s) => [s.data.scientificName, s.data.commonName ?? ''].some((n) => fold(n).includes(fold(q)))).map((s) => s.data.scientificName).sort()
      const got = searchPage(search, { q, page: 1, pageSize: 200 }, new Map()).items.map((i) => i.scientificName)
      const total = searchPage(search, { q, page: 1, pageSize: 200 }, new Map()).total
      expect(total, q).toBe(want.length)
      if (want.length <= 200) expect([...got].sort(), q).toEqual(want)
    }
  })
  it('matches accented and hybrid names whichever way they are typed', () => {
    // USDA PLANTS: Triglochin gaspensis "Gaspé Peninsula arrowgrass"; Acer ×freemanii (Freeman maple), native in Ohio
    for (const q of ['gaspe', 'GASPÉ', 'Gaspe\u0301 pen']) expect(first(q).map((i) => i.scientificName), q).toContain('Triglochin gaspensis')
    for (const q of ['Acer ×freemanii', 'acer x freemanii', 'Acer X freem']) expect(first(q)[0]?.scientificName, q).toBe('Acer ×freemanii')
  })
  it('finds a term at the very start and the very end of the joined names, and never across two names', () => {
    const firstName = search.sci[0]!
    expect(nameHits(search, firstName.slice(0, 4))).toContain(0)
    const last = list.length - 1
    const lastName = search.common[last] || search.sci[last]!
    expect(nameHits(search, lastName.slice(-3))).toContain(last)
    // the end of one scientific name joined to the start of its common name is no name's substring
    const i = search.sci.findIndex((n, k) => search.common[k] && !`${n.slice(-2)}${search.common[k]!.slice(0, 2)}`.includes(' '))
    const across = `${search.sci[i]!.slice(-2)}${search.common[i]!.slice(0, 2)}`
    const want = list.flatMap((_, k) => (search.sci[k]!.includes(across) || search.common[k]!.includes(across) ? [k] : []))
    expect(nameHits(search, across)).toEqual(want)
  })
  it('filters the table by the same rule under a column sort', { timeout: 60_000 }, () => {
    for (const term of ['milk', 'gaspé', 'a']) for (const sort of ['name', 'common', 'height', 'status'] as TableSort[]) for (const dir of ['asc', 'desc'] as const) {
      const named = namedMask(search, term)
      const q = { region: 'US-OH', q: term, sort, dir, page: 2, pageSize: 20 }
      const got = tablePage(table, q, oh, named)
      const want = plainTable(q, (s) => named[s.id - 1] === 1)
      expect({ names: got.items.map((i) => i.scientificName), total: got.total, statuses: got.items.map((i) => i.status) }, JSON.stringify(q)).toEqual(want)
    }
  })
})
