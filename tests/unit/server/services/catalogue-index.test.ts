// The precomputed catalogue structures (sort orders, joined-name search, pre-ranked natives, answer caches) give
// the same answers as the straightforward computation (filter everything, sort everything), checked over the
// committed catalogue (server/assets/catalogue/catalogue.json.gz, derived from USDA PLANTS) for a sample of queries.
import { describe, it, expect } from 'vitest'
import { readFileSync } from 'node:fs'
import { gunzipSync } from 'node:zlib'
import { join } from 'node:path'
import {
  Lru, buildRegionFits, buildSearchIndex, buildTableIndex, collatedChars, foldForLike, isPlainAscii, likeIncludes, likeMatches, likeTableFoldsAsciiCase, nameHits, passes, PRINTABLE_ASCII, rankFits, rankSwaps, scoreFit, fitItem,
  searchPage, tablePage, type CachedSpecies, type FitConditions, type FitItem, type SpeciesSearchQuery, type SpeciesTableQuery,
  type TableSort, type YardContext,
} from '../../../../server/services/catalogue-index'
import { nameKey, zoneIndex, type CatalogueEntry } from '#shared/utils/catalogue-rules'
import type { Layer, RegionStatus } from '#shared/types/species'

const ROOT = join(import.meta.dirname, '..', '..', '..', '..')
const file = JSON.parse(gunzipSync(readFileSync(join(ROOT, 'server', 'assets', 'catalogue', 'catalogue.json.gz'))).toString('utf8')) as { species: CatalogueEntry[] }
const list: CachedSpecies[] = file.species.map(({ regions: _, ...data }, i) => ({ id: i + 1, origin: 'usda', minZoneIndex: zoneIndex(data.minZone), key: nameKey(data.scientificName), data }))
const byId = new Map(list.map((s) => [s.id, s]))
const statusMaps = new Map<string, Map<number, RegionStatus>>()
function statusesOf(region?: string) {
  let m = statusMaps.get(region ?? '')
  if (!m) statusMaps.set(region ?? '', m = new Map(region ? file.species.flatMap((e, i) => (e.regions[region] ? [[i + 1, e.regions[region]!] as const] : [])) : []))
  return m
}

// the database supplies these ranks from its collation; here a case- and accent-folding collator stands in for it
function denseRanks(values: (string | null)[]): number[] {
  const collator = new Intl.Collator('en', { sensitivity: 'base' })
  const order = values.map((_, i) => i).sort((a, b) => (values[a] === null ? -1 : 0) - (values[b] === null ? -1 : 0) || collator.compare(values[a] ?? '', values[b] ?? ''))
  const ranks = new Array<number>(values.length)
  let rank = 0
  order.forEach((i, k) => {
    const prev = k ? order[k - 1]! : -1
    if (k === 0 || (values[i] === null) !== (values[prev] === null) || collator.compare(values[i] ?? '', values[prev] ?? '') !== 0) rank++
    ranks[i] = rank
  })
  return ranks
}
const nameRank = denseRanks(list.map((s) => s.data.scientificName))
const commonRank = denseRanks(list.map((s) => s.data.commonName))

// the straightforward table: the SQL WHERE and ORDER BY written out as filters and key lists over every species
const STATUS_WORDS = ['absent', 'introduced', 'invasive', 'native', 'nativeAndIntroduced']
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
    relevance: (i) => [[list[i]!.data.hasCharacteristics ? 0 : 1, 1], [nameRank[i]!, 1]],
    name: (i) => [[nameRank[i]!, dir]],
    common: (i) => [[list[i]!.data.commonName === null ? 1 : 0, dir], [commonRank[i]!, dir], [nameRank[i]!, 1]],
    layer: (i) => [[LAYER_ENUM.indexOf(list[i]!.data.layer), dir], [nameRank[i]!, 1]],
    height: (i) => [[list[i]!.data.height, dir], [nameRank[i]!, 1]],
    spread: (i) => [[list[i]!.data.spread, dir], [nameRank[i]!, 1]],
    minZone: (i) => [[list[i]!.minZoneIndex === null ? 1 : 0, dir], [list[i]!.minZoneIndex ?? 0, dir], [nameRank[i]!, 1]],
    status: (i) => [[STATUS_WORDS.indexOf(status(i)), dir], [nameRank[i]!, 1]],
  }
  const keyed = new Map(rows.map((i) => [i, keys[q.sort ?? 'name'](i)]))
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
  const table = buildTableIndex(list, nameRank, commonRank)
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
  it('pages past the end to an empty page with the total, and serves a repeat from its cache', () => {
    const statuses = statusesOf('US-OH')
    const q: SpeciesTableQuery = { region: 'US-OH', hasFacts: true, sort: 'name', page: 10_000 }
    const r = tablePage(table, q, statuses)
    expect(r.items).toEqual([])
    expect(r.total).toBe(plainTable(q).total)
    const before = table.results.size
    tablePage(table, { ...q, page: 2 }, statuses)
    expect(table.results.size).toBe(before)
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

// the straightforward search: the scan the search route did before the joined-name index
function plainSearch(q: SpeciesSearchQuery) {
  const statuses = statusesOf(q.region)
  const term = q.q.toLowerCase()
  const hits: { s: CachedSpecies; rank: number }[] = []
  for (const s of list) {
    const d = s.data
    const sci = d.scientificName.toLowerCase()
    const common = (d.commonName ?? '').toLowerCase()
    if (!sci.includes(term) && !common.includes(term)) continue
    if (q.layer && d.layer !== q.layer) continue
    if (q.sun && !d.sun.includes(q.sun)) continue
    if (q.hasFacts && !d.hasCharacteristics) continue
    if (q.status && (statuses.get(s.id) ?? 'absent') !== q.status) continue
    const prefix = sci.startsWith(term) || common.startsWith(term) || common.includes(` ${term}`)
    hits.push({ s, rank: (d.hasCharacteristics ? 2 : 0) + (prefix ? 1 : 0) })
  }
  hits.sort((a, b) => b.rank - a.rank || (a.s.data.scientificName < b.s.data.scientificName ? -1 : a.s.data.scientificName > b.s.data.scientificName ? 1 : 0))
  const page = q.page ?? 1
  const size = q.pageSize ?? 50
  return { names: hits.slice((page - 1) * size, page * size).map((h) => h.s.data.scientificName), total: hits.length }
}

describe('search as you type from the joined names', () => {
  const search = buildSearchIndex(list)
  const terms = ['milk', 'a', 'Asclepias', 'oak', 'quercus alba', 'x', '×', 'é', ' aster', 'ss', 'zzzz', 'e\nb', 'ia\n', 'weed', 'i', 'Zizia aurea']
  it('agrees with scanning every name, for terms, filters and pages', { timeout: 60_000 }, () => {
    for (const q of terms) for (const region of ['US-OH', undefined]) for (const f of [{}, { hasFacts: true }, { layer: 'tree' as const, sun: 'full' as const }]) for (const page of [1, 3]) {
      const query: SpeciesSearchQuery = { q, region, page, pageSize: 10, ...f }
      const got = searchPage(search, query, statusesOf(region))
      expect({ names: got.items.map((i) => i.scientificName), total: got.total }, JSON.stringify(query)).toEqual(plainSearch(query))
    }
  })
  it('finds a term at the very start and the very end of the joined names, and never across two names', () => {
    const first = list[0]!.data.scientificName.toLowerCase()
    const last = list.at(-1)!
    expect(nameHits(search, first.slice(0, 4))).toContain(0)
    const lastName = (last.data.commonName ?? last.data.scientificName).toLowerCase()
    expect(nameHits(search, lastName.slice(-3))).toContain(list.length - 1)
    // the end of one species' scientific name joined to the start of its common name is no name's substring
    const s = list.find((x) => x.data.commonName && !`${x.data.scientificName}${x.data.commonName}`.toLowerCase().slice(x.data.scientificName.length - 2, x.data.scientificName.length + 2).includes(' '))!
    const across = `${s.data.scientificName.slice(-2)}${s.data.commonName!.slice(0, 2)}`.toLowerCase()
    const want = list.flatMap((x, i) => (x.data.scientificName.toLowerCase().includes(across) || (x.data.commonName ?? '').toLowerCase().includes(across) ? [i] : []))
    expect(nameHits(search, across)).toEqual(want)
  })
})

describe('the table\'s name filter for a printable-ASCII term', () => {
  const search = buildSearchIndex(list)
  const table = buildTableIndex(list, nameRank, commonRank)
  it('matches plain ASCII names case-insensitively and leaves every other name to the database', () => {
    const other = list.flatMap((s, i) => (/[^\x20-\x7e]/.test(s.data.scientificName + (s.data.commonName ?? '')) ? [i] : []))
    // the committed catalogue has hybrid names (×Agropogon …) and accented common names (Gaspé …)
    expect(other.length).toBeGreaterThan(0)
    for (const term of ['milk', 'ASCLEP', 'agropogon', 'pe', "'s", 'o-', 'zzzz']) {
      expect(isPlainAscii(term)).toBe(true)
      const { named, collated } = likeMatches(search, term)
      expect(collated).toEqual(other)
      const t = term.toLowerCase()
      const want = list.map((s, i) => Number(!other.includes(i) && (s.data.scientificName.toLowerCase().includes(t) || (s.data.commonName ?? '').toLowerCase().includes(t))))
      expect([...named], term).toEqual(want)
    }
    expect(isPlainAscii('é')).toBe(false)
    expect(isPlainAscii('a\u0001')).toBe(false)
  })
  it('decides names beyond ASCII through the database\'s like table, one character against one', () => {
    // stands in for the database's answer (utf8mb4_unicode_ci: é matches e and E; × and ‘ match no ASCII character)
    const table = new Map<string, Set<string>>([...PRINTABLE_ASCII.map((c) => [c, new Set([c, c.toLowerCase(), c.toUpperCase()])] as const), ['é', new Set(['e', 'E'])], ['×', new Set()], ['‘', new Set()]])
    expect(likeTableFoldsAsciiCase(table)).toBe(true)
    expect(collatedChars(search).sort()).toEqual(['×', '‘', 'é'].sort())
    expect(likeIncludes('Gaspé Peninsula arrowgrass', 'SPE P', table)).toBe(true)
    expect(likeIncludes('×Agropogon littoralis', 'agro', table)).toBe(true)
    expect(likeIncludes('×Agropogon littoralis', 'xagro', table)).toBe(false)
    expect(likeIncludes('‘ilima', "'i", table)).toBe(false)
    expect(likeIncludes('Gaspé', 'gaspe', new Map())).toBeNull()
    expect(foldForLike('×Agropogon Gaspé', table)).toBe('\nagropogon gaspe')
    expect(foldForLike('Gaspé', new Map([['é', new Set(['e', 'a'])]]))).toBeNull()
    // a character matching two letters is decided character by character
    const two = new Map([...table, ['é', new Set(['e', 'a'])]])
    expect(likeIncludes('Gaspé', 'aspa', two)).toBe(true)
    expect(likeMatches(search, 'gaspa', two).named[list.findIndex((s) => s.data.commonName === 'Gaspé Peninsula arrowgrass')]).toBe(1)
    for (const term of ['gasp', 'agropogon', 'pe', 'ilima', 'zzzz']) {
      const { named, collated } = likeMatches(search, term, table)
      expect(collated).toEqual([])
      const want = list.map((s) => Number([s.data.scientificName, s.data.commonName ?? ''].some((n) => n.toLowerCase().replace(/é/g, 'e').includes(term))))
      expect([...named], term).toEqual(want)
    }
    // a character the table lacks leaves its names to the database
    const partial = new Map(table)
    partial.delete('é')
    expect(likeMatches(search, 'arrowgrass', partial).collated.map((i) => list[i]!.data.commonName)).toEqual(list.filter((s) => s.data.commonName?.includes('é')).map((s) => s.data.commonName))
  })
  it('pages the filtered table like filtering and sorting everything', { timeout: 60_000 }, () => {
    for (const term of ['milk', 'oak', 'a']) for (const sort of ['name', 'common', 'height', 'status'] as TableSort[]) for (const dir of ['asc', 'desc'] as const) {
      const { named } = likeMatches(search, term)
      const q = { region: 'US-OH', q: term, sort, dir, page: 2, pageSize: 20 }
      const got = tablePage(table, q, statusesOf('US-OH'), named)
      const want = plainTable(q, (s) => named[s.id - 1] === 1)
      expect({ names: got.items.map((i) => i.scientificName), total: got.total, statuses: got.items.map((i) => i.status) }, JSON.stringify(q)).toEqual(want)
    }
  })
})

// the straightforward fits: score every native of the region, sort all, word the first `limit`
function plainFits(region: string, c: FitConditions, yard: YardContext | null, limit: number): FitItem[] {
  const statuses = statusesOf(region)
  const zoneIdx = zoneIndex(c.zone)
  const scored: { s: CachedSpecies; score: number }[] = []
  for (const [id, status] of statuses) {
    const s = byId.get(id)!
    if (!passes(s, status, c, zoneIdx)) continue
    scored.push({ s, score: scoreFit(s, c, yard) })
  }
  scored.sort((a, b) => b.score - a.score || (a.s.data.scientificName < b.s.data.scientificName ? -1 : a.s.data.scientificName > b.s.data.scientificName ? 1 : 0))
  return scored.slice(0, limit).map(({ s, score }) => {
    const reasons: string[] = []
    scoreFit(s, c, yard, reasons)
    return fitItem(s, 'native', score, reasons)
  })
}

describe('good fits from pre-ranked natives', () => {
  const conditions: Omit<FitConditions, 'region'>[] = [
    {}, { zone: '6a' }, { zone: '6a', sun: 'part', soil: 'clay', moisture: 'wet' }, { sun: 'full', layer: 'tree', maxSpread: 5 },
    { zone: '3b', sun: 'shade', moisture: 'dry' }, { zone: '9a', soil: 'sand', layer: 'shrub' }, { maxSpread: 0.3 }, { zone: '1a', layer: 'tree' },
  ]
  const yards: (YardContext | null)[] = [null, { bloomMonths: new Set([7]), layers: new Set(['ground']) }, { bloomMonths: new Set(), layers: new Set() }, { bloomMonths: new Set([3, 4, 5, 6, 7, 8, 9, 10]), layers: new Set(['tree', 'shrub', 'ground']) }]
  for (const region of ['US-OH', 'CA-ON', 'US-TX', 'US-HI']) {
    it(`agrees with scoring every native (${region})`, { timeout: 60_000 }, () => {
      const rf = buildRegionFits(statusesOf(region), byId)
      for (const c of conditions) for (const yard of yards) for (const limit of [1, 50, 200]) {
        const cond = { region, ...c }
        expect(rankFits(rf, cond, yard, limit), JSON.stringify({ c, limit, yard: !!yard })).toEqual(plainFits(region, cond, yard, limit))
      }
    })
  }
  it('answers a repeated request from its cache, and a different one afresh', () => {
    const rf = buildRegionFits(statusesOf('US-OH'), byId)
    const a = rankFits(rf, { region: 'US-OH', zone: '6a' }, null, 50)
    expect(rankFits(rf, { region: 'US-OH', zone: '6a' }, null, 50)).toBe(a)
    expect(rankFits(rf, { region: 'US-OH', zone: '6b' }, null, 50)).not.toBe(a)
  })

  // the straightforward swaps: every native of the layer and size, scored and sorted
  function plainSwaps(region: string, target: CachedSpecies, c: Omit<FitConditions, 'layer' | 'maxSpread'>, limit: number) {
    const zoneIdx = zoneIndex(c.zone)
    const cond: FitConditions = { ...c, layer: target.data.layer }
    const scored: { s: CachedSpecies; score: number }[] = []
    for (const [id, status] of statusesOf(region)) {
      const s = byId.get(id)!
      if (!passes(s, status, cond, zoneIdx)) continue
      const ratio = s.data.height / target.data.height
      if (ratio < 0.5 || ratio > 2) continue
      scored.push({ s, score: Math.min(100, scoreFit(s, cond, null) + Math.round(20 * (1 - Math.abs(Math.log2(ratio))))) })
    }
    scored.sort((a, b) => b.score - a.score || (a.s.data.scientificName < b.s.data.scientificName ? -1 : a.s.data.scientificName > b.s.data.scientificName ? 1 : 0))
    return scored.slice(0, limit).map(({ s, score }) => {
      const reasons = [`Same layer (${s.data.layer}) and similar size: ${s.data.height} m tall, against ${target.data.height} m`]
      scoreFit(s, cond, null, reasons)
      return fitItem(s, 'native', score, reasons)
    })
  }
  it('swaps agree with scoring every native of the layer and size', { timeout: 60_000 }, () => {
    for (const region of ['US-OH', 'US-TX']) {
      const rf = buildRegionFits(statusesOf(region), byId)
      for (const name of ['Berberis thunbergii', 'Lolium perenne', 'Acer platanoides', 'Lonicera maackii']) {
        const target = list.find((s) => s.data.scientificName === name)!
        for (const c of [{ region }, { region, zone: '6a', sun: 'full' }, { region, moisture: 'wet', soil: 'clay' }]) {
          expect(rankSwaps(rf, target, c, 20)).toEqual(plainSwaps(region, target, c, 20))
        }
      }
    }
  })
})

describe('Lru', () => {
  it('keeps the most recently used entries up to its size', () => {
    const lru = new Lru<string, number>(2)
    lru.set('a', 1)
    lru.set('b', 2)
    expect(lru.get('a')).toBe(1)
    lru.set('c', 3)
    expect(lru.get('b')).toBeUndefined()
    expect(lru.get('a')).toBe(1)
    expect(lru.get('c')).toBe(3)
    expect(lru.size).toBe(2)
  })
})
