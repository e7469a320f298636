// Precomputed structures over one in-memory catalogue copy, so the species table and search-as-you-type answer
// from memory with little work per request: names ranked once by the one name collator, sort orders per column
// (and per region for the status and best-match orders), and a joined, folded name string for substring search.
// Matching is the one rule of shared/utils/species-name.ts (case and accents folded, × read as x); ranking puts
// the region's natives first, then what is recorded there, then the rest (shared/utils/species-status.ts).
// Everything here is pure (no database, no Nitro auto-imports); catalogue.ts builds these once per copy.
import type { CatalogueSpeciesData } from '../database/schema/catalogue'
import { LAYERS, type Layer, type RegionStatus } from '#shared/types/species'
import { SPECIES_PAGE_SIZE, type SpeciesListQuery } from '#shared/schemas/species'
import { compareNames, foldName, matchQuality } from '#shared/utils/species-name'
import { STATUS_ORDER, statusGroup } from '#shared/utils/species-status'

export interface CachedSpecies {
  id: number
  origin: 'usda' | 'coordinator'
  minZoneIndex: number | null
  key: string
  data: CatalogueSpeciesData
}

/** Dense ranks of values in the name collator's order (equal names share a rank; null sorts first). */
export function denseRanks(values: (string | null)[]): Int32Array {
  const order = values.map((_, i) => i).sort((a, b) => Number(values[b] === null) - Number(values[a] === null) || compareNames(values[a] ?? '', values[b] ?? ''))
  const ranks = new Int32Array(values.length)
  let rank = 0
  order.forEach((i, k) => {
    const prev = k ? order[k - 1]! : -1
    if (k === 0 || (values[i] === null) !== (values[prev] === null) || compareNames(values[i] ?? '', values[prev] ?? '') !== 0) rank++
    ranks[i] = rank
  })
  return ranks
}

// ---------------------------------------------------------------------------------------------------------
// The species table: filter, sort and page from memory

export type SpeciesTableQuery = Omit<SpeciesListQuery, 'q'>
export type TableSort = Exclude<SpeciesListQuery['sort'], undefined>

export interface TableIndex {
  list: CachedSpecies[]
  /** rank of each list entry's scientific / common name by the name collator (ties share a rank) */
  nameRank: Int32Array
  commonRank: Int32Array
  /** whole-list orders, made on first use per sort (and per region for status and best match) */
  orders: Map<string, Int32Array>
}

export function buildTableIndex(list: CachedSpecies[]): TableIndex {
  return {
    list,
    nameRank: denseRanks(list.map((s) => s.data.scientificName)),
    commonRank: denseRanks(list.map((s) => s.data.commonName)),
    orders: new Map(),
  }
}

const LAYER_ORDER = Object.fromEntries(LAYERS.map((l, i) => [l, i])) as Record<Layer, number>

/**
 * The comparator of list positions for a sort: the column in the chosen direction, nulls last, then the
 * scientific name. `relevance` (best match, no term): natives of the region, then recorded there, then the rest;
 * in each, species with USDA growing facts first, then by name; the direction does not apply.
 */
export function tableComparator(ix: TableIndex, sort: TableSort, desc: boolean, statuses?: Map<number, RegionStatus>): (a: number, b: number) => number {
  const s = desc ? -1 : 1
  const L = ix.list
  const nr = ix.nameRank
  const cr = ix.commonRank
  const status = (i: number) => statuses?.get(L[i]!.id) ?? 'absent'
  switch (sort) {
    case 'name': return (a, b) => s * (nr[a]! - nr[b]!)
    case 'relevance': return (a, b) => statusGroup(status(a)) - statusGroup(status(b))
      || Number(L[b]!.data.hasCharacteristics) - Number(L[a]!.data.hasCharacteristics) || nr[a]! - nr[b]!
    case 'common': return (a, b) => Number(L[a]!.data.commonName === null) - Number(L[b]!.data.commonName === null) || s * (cr[a]! - cr[b]!) || nr[a]! - nr[b]!
    case 'layer': return (a, b) => s * (LAYER_ORDER[L[a]!.data.layer] - LAYER_ORDER[L[b]!.data.layer]) || nr[a]! - nr[b]!
    case 'height': return (a, b) => s * (L[a]!.data.height - L[b]!.data.height) || nr[a]! - nr[b]!
    case 'spread': return (a, b) => s * (L[a]!.data.spread - L[b]!.data.spread) || nr[a]! - nr[b]!
    case 'minZone': return (a, b) => {
      const za = L[a]!.minZoneIndex
      const zb = L[b]!.minZoneIndex
      return Number(za === null) - Number(zb === null) || s * ((za ?? 0) - (zb ?? 0)) || nr[a]! - nr[b]!
    }
    case 'status': return (a, b) => s * (STATUS_ORDER[status(a)] - STATUS_ORDER[status(b)]) || nr[a]! - nr[b]!
  }
}

/** The whole list in one sort order, made once per catalogue copy (per region where the status counts). */
function tableOrder(ix: TableIndex, sort: TableSort, desc: boolean, region: string | undefined, statuses: Map<number, RegionStatus>): Int32Array {
  const key = sort === 'status' || sort === 'relevance' ? `${sort}:${desc}:${region ?? ''}` : `${sort}:${desc}`
  let order = ix.orders.get(key)
  if (!order) {
    order = new Int32Array(ix.list.length).map((_, i) => i).sort(tableComparator(ix, sort, desc, statuses))
    // bounded: eight sorts × two directions, and the region-dependent ones by the number of regions (about seventy)
    ix.orders.set(key, order)
  }
  return order
}

/** Whether a species passes the table's filters. */
export function tableFilter(q: SpeciesTableQuery, statuses: Map<number, RegionStatus>): (s: CachedSpecies) => boolean {
  return (s) => {
    const d = s.data
    if (q.layer && d.layer !== q.layer) return false
    if (q.sun && !d.sun.includes(q.sun)) return false
    if (q.moisture && !d.moisture.includes(q.moisture)) return false
    if (q.soil && !d.soil.includes(q.soil)) return false
    if (q.hasFacts && !d.hasCharacteristics) return false
    if (q.status && (statuses.get(s.id) ?? 'absent') !== q.status) return false
    return true
  }
}

/** List positions of the species passing the filters (and, given `named`, whose name matches), in the requested order. */
export function tableMatches(ix: TableIndex, q: SpeciesListQuery, statuses: Map<number, RegionStatus>, named?: Uint8Array): Int32Array {
  const order = tableOrder(ix, q.sort ?? 'relevance', q.dir === 'desc', q.region, statuses)
  const pass = tableFilter(q, statuses)
  const out = new Int32Array(order.length)
  let n = 0
  for (let k = 0; k < order.length; k++) if ((!named || named[order[k]!]) && pass(ix.list[order[k]!]!)) out[n++] = order[k]!
  return out.subarray(0, n)
}

/** One row of the species table. */
export function tableItem(s: CachedSpecies, status: RegionStatus | null) {
  const d = s.data
  return {
    scientificName: d.scientificName, commonName: d.commonName, layer: d.layer, height: d.height, spread: d.spread,
    sun: d.sun, moisture: d.moisture, soil: d.soil, bloomMonths: d.bloomMonths, minZone: d.minZone, toxic: d.toxic,
    hasFacts: d.hasCharacteristics, origin: s.origin, status, estimated: d.estimated, spacing: d.spacing ?? null,
    sources: { height: d.sources.height ?? null, minZone: d.sources.minZone ?? null },
  }
}

/** One page of species table rows from positions into `list`; `statuses` given when the query names a region. */
function pageOf(list: CachedSpecies[], positions: ArrayLike<number>, page: number, pageSize: number, statuses: Map<number, RegionStatus> | null) {
  const items = []
  for (let k = (page - 1) * pageSize; k < Math.min(positions.length, page * pageSize); k++) {
    const s = list[positions[k]!]!
    items.push(tableItem(s, statuses ? statuses.get(s.id) ?? 'absent' : null))
  }
  return { items, total: positions.length, page, pageSize }
}

export function tablePage(ix: TableIndex, q: SpeciesListQuery, statuses: Map<number, RegionStatus>, named?: Uint8Array) {
  const hits = tableMatches(ix, q, statuses, named)
  return pageOf(ix.list, hits, q.page ?? 1, q.pageSize ?? SPECIES_PAGE_SIZE, q.region ? statuses : null)
}

// ---------------------------------------------------------------------------------------------------------
// Search as you type: the folded term inside the folded scientific or common name

export interface SearchIndex {
  list: CachedSpecies[]
  nameRank: Int32Array
  /** folded names (foldName), per list position */
  sci: string[]
  common: string[]
  /** every folded name, scientific then common for each species, joined by newlines (a folded term has none) */
  hay: string
  /** where each name starts in `hay`: species i's scientific name is segment 2i, its common name 2i + 1 */
  starts: Int32Array
}

export function buildSearchIndex(table: TableIndex): SearchIndex {
  const list = table.list
  const sci = list.map((s) => foldName(s.data.scientificName))
  const common = list.map((s) => foldName(s.data.commonName ?? ''))
  const starts = new Int32Array(list.length * 2)
  const parts: string[] = []
  let at = 0
  for (let i = 0; i < list.length; i++) {
    starts[2 * i] = at
    at += sci[i]!.length + 1
    starts[2 * i + 1] = at
    at += common[i]!.length + 1
    parts.push(sci[i]!, common[i]!)
  }
  return { list, nameRank: table.nameRank, sci, common, hay: parts.join('\n'), starts }
}

/** List positions whose folded scientific or common name contains the folded term, in list order. */
export function nameHits(ix: SearchIndex, term: string): number[] {
  const hits: number[] = []
  if (!term) return hits
  const { hay, starts } = ix
  let pos = hay.indexOf(term)
  while (pos !== -1) {
    // the last name starting at or before pos holds the whole match (names are separated by newlines)
    let lo = 0
    let hi = starts.length - 1
    while (lo < hi) {
      const mid = (lo + hi + 1) >> 1
      if (starts[mid]! <= pos) lo = mid
      else hi = mid - 1
    }
    const i = lo >> 1
    hits.push(i)
    if (i + 1 >= ix.list.length) break
    pos = hay.indexOf(term, starts[2 * i + 2]!)
  }
  return hits
}

/** 1 per list position whose name matches the term (the table's name filter under a column sort). */
export function namedMask(ix: SearchIndex, term: string): Uint8Array {
  const named = new Uint8Array(ix.list.length)
  for (const i of nameHits(ix, foldName(term))) named[i] = 1
  return named
}

export type SpeciesSearchQuery = SpeciesListQuery & { q: string }

/**
 * Matching list positions, best first: the region's natives, then what is recorded there, then the rest; in
 * each group by how well a name matches (whole name, its start, a word's start, inside a word), then species with
 * USDA growing facts, then by name.
 */
export function searchMatches(ix: SearchIndex, q: SpeciesSearchQuery, statuses: Map<number, RegionStatus>): Int32Array {
  const term = foldName(q.q)
  const pass = tableFilter(q, statuses)
  const hits: { i: number; rank: number }[] = []
  for (const i of nameHits(ix, term)) {
    const s = ix.list[i]!
    if (!pass(s)) continue
    const quality = Math.max(matchQuality(ix.sci[i]!, term), matchQuality(ix.common[i]!, term))
    // one number: group (0–2) × 10 + (4 − quality) × 2 + no facts; smaller is better
    hits.push({ i, rank: statusGroup(statuses.get(s.id)) * 10 + (4 - quality) * 2 + (s.data.hasCharacteristics ? 0 : 1) })
  }
  hits.sort((a, b) => a.rank - b.rank || ix.nameRank[a.i]! - ix.nameRank[b.i]!)
  return Int32Array.from(hits, (h) => h.i)
}

export function searchPage(ix: SearchIndex, q: SpeciesSearchQuery, statuses: Map<number, RegionStatus>) {
  const ranked = searchMatches(ix, q, statuses)
  return pageOf(ix.list, ranked, q.page ?? 1, q.pageSize ?? SPECIES_PAGE_SIZE, q.region ? statuses : null)
}
