// Precomputed structures over one in-memory catalogue copy, so the species table, search-as-you-type and good
// fits answer from memory with little work per request: sort orders per column (and per region for status),
// a joined lower-case name string for substring search, each region's natives pre-ranked by the parts of the fit
// score that do not depend on the request, and small caches of answers. Everything here is pure (no database,
// no Nitro auto-imports); catalogue.ts builds these once per catalogue copy, so a stamp change drops them all.
import type { CatalogueSpeciesData } from '../database/schema/catalogue'
import { LAYERS, type Layer, type RegionStatus } from '#shared/types/species'
import { SPECIES_PAGE_SIZE, type SpeciesListQuery } from '#shared/schemas/species'
import { zoneIndex } from '#shared/utils/catalogue-rules'

export interface CachedSpecies {
  id: number
  origin: 'usda' | 'coordinator'
  minZoneIndex: number | null
  key: string
  data: CatalogueSpeciesData
}

/** A small least-recently-used map: a Map keeps insertion order, so re-inserting on a hit keeps the newest last. */
export class Lru<K, V> {
  private map = new Map<K, V>()
  constructor(private readonly max: number) {}
  get(key: K): V | undefined {
    const v = this.map.get(key)
    if (v !== undefined) { this.map.delete(key); this.map.set(key, v) }
    return v
  }
  set(key: K, value: V) {
    this.map.delete(key)
    this.map.set(key, value)
    if (this.map.size > this.max) this.map.delete(this.map.keys().next().value as K)
  }
  delete(key: K) { this.map.delete(key) }
  get size() { return this.map.size }
}

// code-unit order: stable and far cheaper than localeCompare over thousands of names
const byCodeUnits = (a: string, b: string) => (a < b ? -1 : a > b ? 1 : 0)

// ---------------------------------------------------------------------------------------------------------
// The species table (no search term): filter, sort and page from memory

export type SpeciesTableQuery = Omit<SpeciesListQuery, 'q'>
export type TableSort = Exclude<SpeciesListQuery['sort'], undefined>

export interface TableIndex {
  list: CachedSpecies[]
  /** rank of each list entry's scientific / common name in the database's own collation (ties share a rank) */
  nameRank: Int32Array
  commonRank: Int32Array
  orders: Map<string, Int32Array>
  results: Lru<string, Int32Array>
}

export function buildTableIndex(list: CachedSpecies[], nameRank: ArrayLike<number>, commonRank: ArrayLike<number>): TableIndex {
  return { list, nameRank: Int32Array.from(nameRank), commonRank: Int32Array.from(commonRank), orders: new Map(), results: new Lru(128) }
}

// the string order of the status words (what ORDER BY coalesce(status, 'absent') gives)
const STATUS_ORDER: Record<RegionStatus, number> = { absent: 0, introduced: 1, invasive: 2, native: 3, nativeAndIntroduced: 4 }
const LAYER_ORDER = Object.fromEntries(LAYERS.map((l, i) => [l, i])) as Record<Layer, number>

/**
 * The comparator of list positions for a sort, the same ORDER BY the SQL table used: the column in the chosen
 * direction, nulls as a separate key where the column has them, then scientific name ascending.
 */
export function tableComparator(ix: TableIndex, sort: TableSort, desc: boolean, statuses?: Map<number, RegionStatus>): (a: number, b: number) => number {
  const s = desc ? -1 : 1
  const L = ix.list
  const nr = ix.nameRank
  const cr = ix.commonRank
  switch (sort) {
    case 'name': return (a, b) => s * (nr[a]! - nr[b]!)
    // plantable species (with USDA facts) first, then by name; the direction does not apply
    case 'relevance': return (a, b) => Number(L[b]!.data.hasCharacteristics) - Number(L[a]!.data.hasCharacteristics) || nr[a]! - nr[b]!
    case 'common': return (a, b) => s * (Number(L[a]!.data.commonName === null) - Number(L[b]!.data.commonName === null) || cr[a]! - cr[b]!) || nr[a]! - nr[b]!
    case 'layer': return (a, b) => s * (LAYER_ORDER[L[a]!.data.layer] - LAYER_ORDER[L[b]!.data.layer]) || nr[a]! - nr[b]!
    case 'height': return (a, b) => s * (L[a]!.data.height - L[b]!.data.height) || nr[a]! - nr[b]!
    case 'spread': return (a, b) => s * (L[a]!.data.spread - L[b]!.data.spread) || nr[a]! - nr[b]!
    case 'minZone': return (a, b) => {
      const za = L[a]!.minZoneIndex
      const zb = L[b]!.minZoneIndex
      return s * (Number(za === null) - Number(zb === null) || (za ?? 0) - (zb ?? 0)) || nr[a]! - nr[b]!
    }
    case 'status': {
      const st = (i: number) => STATUS_ORDER[statuses?.get(L[i]!.id) ?? 'absent']
      return (a, b) => s * (st(a) - st(b)) || nr[a]! - nr[b]!
    }
  }
}

/** The whole list in one sort order, made once per catalogue copy (per region for the status sort). */
function tableOrder(ix: TableIndex, sort: TableSort, desc: boolean, region: string | undefined, statuses: Map<number, RegionStatus>): Int32Array {
  const key = sort === 'status' ? `status:${desc}:${region ?? ''}` : `${sort}:${desc}`
  let order = ix.orders.get(key)
  if (!order) {
    order = new Int32Array(ix.list.length).map((_, i) => i).sort(tableComparator(ix, sort, desc, statuses))
    // per-region status orders are bounded by the number of regions (about seventy)
    ix.orders.set(key, order)
  }
  return order
}

/** Whether a species passes the table's filters (the same conditions the SQL WHERE had). */
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

/**
 * List positions of the species passing the filters, in the requested order; cached per query on this copy.
 * `named` (per list position, 1 = the name matches the query's term) narrows it to a name search.
 */
export function tableMatches(ix: TableIndex, q: SpeciesListQuery, statuses: Map<number, RegionStatus>, named?: Uint8Array): Int32Array {
  const sort = q.sort ?? 'name'
  const desc = q.dir === 'desc'
  const key = JSON.stringify([q.region ?? '', sort, desc, q.layer ?? '', q.sun ?? '', q.moisture ?? '', q.soil ?? '', !!q.hasFacts, q.status ?? '', named ? q.q ?? '' : ''])
  let hits = ix.results.get(key)
  if (!hits) {
    const order = tableOrder(ix, sort, desc, q.region, statuses)
    const pass = tableFilter(q, statuses)
    const out = new Int32Array(order.length)
    let n = 0
    for (let k = 0; k < order.length; k++) if ((!named || named[order[k]!]) && pass(ix.list[order[k]!]!)) out[n++] = order[k]!
    hits = out.slice(0, n)
    ix.results.set(key, hits)
  }
  return hits
}

/** One row of the species table (the same fields the SQL table gave). */
export function tableItem(s: CachedSpecies, status: RegionStatus | null) {
  const d = s.data
  return {
    scientificName: d.scientificName, commonName: d.commonName, layer: d.layer, height: d.height, spread: d.spread,
    sun: d.sun, moisture: d.moisture, soil: d.soil, bloomMonths: d.bloomMonths, minZone: d.minZone, toxic: d.toxic,
    hasFacts: d.hasCharacteristics, origin: s.origin, status, estimated: d.estimated, spacing: d.spacing ?? null,
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
  const page = q.page ?? 1
  const pageSize = q.pageSize ?? SPECIES_PAGE_SIZE
  const hits = tableMatches(ix, q, statuses, named)
  return pageOf(ix.list, hits, page, pageSize, q.region ? statuses : null)
}

// ---------------------------------------------------------------------------------------------------------
// Search as you type: substring of the lower-cased scientific or common name

export interface SearchIndex {
  list: CachedSpecies[]
  sci: string[]
  common: string[]
  /** every name lower-cased, scientific then common for each species, joined by newlines (a term has none) */
  hay: string
  /** where each name starts in `hay`: species i's scientific name is segment 2i, its common name 2i + 1 */
  starts: Int32Array
  results: Lru<string, Int32Array>
  /** list positions of species with a name outside printable ASCII, where only the database knows its collation's `like` */
  collated: number[]
}

export function buildSearchIndex(list: CachedSpecies[]): SearchIndex {
  const sci = list.map((s) => s.data.scientificName.toLowerCase())
  const common = list.map((s) => (s.data.commonName ?? '').toLowerCase())
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
  const collated = list.flatMap((s, i) => (isPlainAscii(s.data.scientificName) && isPlainAscii(s.data.commonName ?? '') ? [] : [i]))
  return { list, sci, common, hay: parts.join('\n'), starts, results: new Lru(256), collated }
}

/** Printable ASCII only: there the collation's `like '%term%'` is a case-insensitive substring, nothing more. */
export function isPlainAscii(text: string) {
  return /^[\x20-\x7e]*$/.test(text)
}

export const PRINTABLE_ASCII = Array.from({ length: 95 }, (_, i) => String.fromCharCode(32 + i))

/**
 * For each character, the printable-ASCII characters it matches as a one-character `like` pattern in the
 * database's collation (asked of the database once per copy). `like` compares one character with one character,
 * so with this table `like '%term%'` can be decided here for names beyond ASCII too.
 */
export type LikeTable = Map<string, Set<string>>

/** The characters beyond printable ASCII in the collated names: what the like table must cover. */
export function collatedChars(ix: SearchIndex): string[] {
  const chars = new Set<string>()
  for (const i of ix.collated) for (const c of ix.list[i]!.data.scientificName + (ix.list[i]!.data.commonName ?? '')) if (!isPlainAscii(c)) chars.add(c)
  return [...chars]
}

/** Whether the database's table gives printable ASCII exactly letter-case folding (what matching plain names here assumes). */
export function likeTableFoldsAsciiCase(t: LikeTable): boolean {
  return PRINTABLE_ASCII.every((c) => {
    const want = new Set([c, c.toLowerCase(), c.toUpperCase()])
    const got = t.get(c)
    return !!got && got.size === want.size && [...want].every((x) => got.has(x))
  })
}

/** `name like '%term%'` for a printable-ASCII term, one character against one; null when a character is not in the table. */
export function likeIncludes(name: string, term: string, t: LikeTable): boolean | null {
  const n = Array.from(name)
  for (const c of n) if (!isPlainAscii(c) && !t.has(c)) return null
  const lower = term.toLowerCase()
  const same = (c: string, k: number) => (isPlainAscii(c) ? c.toLowerCase() === lower[k] : t.get(c)!.has(term[k]!))
  outer: for (let i = 0; i + term.length <= n.length; i++) {
    for (let k = 0; k < term.length; k++) if (!same(n[i + k]!, k)) continue outer
    return true
  }
  return false
}

/**
 * A name folded for `like` against a lower-case printable-ASCII term: ASCII lower-cased, a character beyond it
 * replaced by the one lower-case character it matches, or by a newline (no term has one) when it matches none;
 * null when some character matches several or is not in the table (then likeIncludes decides, or the database).
 */
export function foldForLike(name: string, t: LikeTable): string | null {
  let out = ''
  for (const c of name) {
    if (isPlainAscii(c)) { out += c.toLowerCase(); continue }
    const matches = t.get(c)
    if (!matches) return null
    const lower = new Set([...matches].map((x) => x.toLowerCase()))
    if (lower.size > 1) return null
    out += lower.size ? [...lower][0] : '\n'
  }
  return out
}

// folds of the collated names, made once per search index and like table
const folded = new WeakMap<LikeTable, WeakMap<SearchIndex, { sci: (string | null)[]; common: (string | null)[] }>>()
function likeFolds(ix: SearchIndex, t: LikeTable) {
  let perIndex = folded.get(t)
  if (!perIndex) folded.set(t, perIndex = new WeakMap())
  let f = perIndex.get(ix)
  if (!f) {
    f = { sci: ix.collated.map((i) => foldForLike(ix.list[i]!.data.scientificName, t)), common: ix.collated.map((i) => foldForLike(ix.list[i]!.data.commonName ?? '', t)) }
    perIndex.set(ix, f)
  }
  return f
}

/**
 * What `scientific_name like '%term%' or common_name like '%term%'` selects, for a printable-ASCII term, as 1 per
 * matching list position: plain ASCII names by case-insensitive substring, the others (accents, the hybrid sign …)
 * through the database's like table; `collated` lists those still left for the database (no table, or a character
 * the table lacks).
 */
export function likeMatches(ix: SearchIndex, term: string, table?: LikeTable | null): { named: Uint8Array; collated: number[] } {
  const named = new Uint8Array(ix.list.length)
  for (const i of nameHits(ix, term.toLowerCase())) named[i] = 1
  const collated: number[] = []
  const folds = table ? likeFolds(ix, table) : null
  const lower = term.toLowerCase()
  ix.collated.forEach((i, k) => {
    named[i] = 0
    const d = ix.list[i]!.data
    const sciFold = folds?.sci[k]
    const commonFold = folds?.common[k]
    const sci = !table ? null : typeof sciFold === 'string' ? sciFold.includes(lower) : likeIncludes(d.scientificName, term, table)
    const common = d.commonName === null ? false : !table ? null : typeof commonFold === 'string' ? commonFold.includes(lower) : likeIncludes(d.commonName, term, table)
    if (sci === true || common === true) named[i] = 1
    else if (sci === null || common === null) collated.push(i)
  })
  return { named, collated }
}

/** List positions whose scientific or common name contains the lower-case term, in list order. */
export function nameHits(ix: SearchIndex, term: string): number[] {
  const hits: number[] = []
  if (term.includes('\n')) {
    for (let i = 0; i < ix.list.length; i++) if (ix.sci[i]!.includes(term) || ix.common[i]!.includes(term)) hits.push(i)
    return hits
  }
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

export type SpeciesSearchQuery = SpeciesListQuery & { q: string }

/** Matching list positions, ranked: plantable species (with USDA facts) first, then names starting with the term. */
export function searchMatches(ix: SearchIndex, q: SpeciesSearchQuery, statuses: Map<number, RegionStatus>): Int32Array {
  const term = q.q.toLowerCase()
  const key = JSON.stringify([q.region ?? '', term, q.layer ?? '', q.sun ?? '', q.moisture ?? '', q.soil ?? '', !!q.hasFacts, q.status ?? ''])
  let ranked = ix.results.get(key)
  if (!ranked) {
    const pass = tableFilter(q, statuses)
    const hits: { i: number; rank: number }[] = []
    for (const i of nameHits(ix, term)) {
      const s = ix.list[i]!
      if (!pass(s)) continue
      const sci = ix.sci[i]!
      const common = ix.common[i]!
      const prefix = sci.startsWith(term) || common.startsWith(term) || common.includes(` ${term}`)
      hits.push({ i, rank: (s.data.hasCharacteristics ? 2 : 0) + (prefix ? 1 : 0) })
    }
    hits.sort((a, b) => b.rank - a.rank || byCodeUnits(ix.list[a.i]!.data.scientificName, ix.list[b.i]!.data.scientificName))
    ranked = Int32Array.from(hits, (h) => h.i)
    ix.results.set(key, ranked)
  }
  return ranked
}

export function searchPage(ix: SearchIndex, q: SpeciesSearchQuery, statuses: Map<number, RegionStatus>) {
  const page = q.page ?? 1
  const pageSize = q.pageSize ?? SPECIES_PAGE_SIZE
  const ranked = searchMatches(ix, q, statuses)
  return pageOf(ix.list, ranked, page, pageSize, q.region ? statuses : null)
}

// ---------------------------------------------------------------------------------------------------------
// Good fits and swaps

export interface FitConditions {
  region: string
  zone?: string | null
  sun?: string
  soil?: string
  moisture?: string
  layer?: Layer
  maxSpread?: number
}

export interface YardContext {
  /** months (1–12) in which some native planting blooms */
  bloomMonths: Set<number>
  /** layers that have at least one native planting */
  layers: Set<Layer>
}

export interface FitItem {
  scientificName: string
  commonName: string | null
  layer: Layer
  spread: number
  height: number
  spacing: number | null
  minZone: string | null
  sun: string[]
  soil: string[]
  moisture: string[]
  bloomMonths: number[]
  toxic: boolean
  estimated: string[]
  status: RegionStatus
  score: number
  reasons: string[]
}

const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December']
// the months a yard shows bloom in (northern temperate growing season)
export const BLOOM_SEASON = [3, 4, 5, 6, 7, 8, 9, 10]
const SUN_WORDS: Record<string, string> = { full: 'full sun', part: 'part shade', shade: 'shade' }
const SOIL_WORDS: Record<string, string> = { sand: 'sandy', loam: 'loamy', clay: 'clay' }
const MOISTURE_WORDS: Record<string, string> = { dry: 'dry', medium: 'medium (moist, well-drained)', wet: 'wet' }

/** Whether a species passes the hard filters: native in the region, hardy in the zone, takes the site, fits. */
export function passes(s: CachedSpecies, status: RegionStatus | undefined, c: FitConditions, zoneIdx: number | null): boolean {
  const d = s.data
  if (status !== 'native') return false
  if (zoneIdx !== null && (s.minZoneIndex === null || s.minZoneIndex > zoneIdx)) return false
  if (c.layer && d.layer !== c.layer) return false
  if (c.sun && !d.sun.includes(c.sun as never)) return false
  if (c.soil && !d.soil.includes(c.soil as never)) return false
  if (c.moisture && !d.moisture.includes(c.moisture as never)) return false
  if (c.maxSpread !== undefined && d.spread > c.maxSpread) return false
  return true
}

/**
 * Score 0–100; the reasons in plain words are written into `reasons` when given (`reasons?.push(…)` skips
 * building the words when not, so ranking thousands of natives only words the ones shown).
 */
export function scoreFit(s: CachedSpecies, c: FitConditions, yard: YardContext | null, reasons?: string[]): number {
  const d = s.data
  let score = 0
  const site: string[] = []
  if (c.sun) { score += 15; site.push(SUN_WORDS[c.sun]!) }
  if (c.soil) { score += 10; site.push(`${SOIL_WORDS[c.soil]} soil`) }
  if (c.moisture) { score += 10; site.push(`${MOISTURE_WORDS[c.moisture]} ground`) }
  if (site.length) reasons?.push(`Takes ${site.join(', ')}`)
  if (c.zone && d.minZone) { score += 10; reasons?.push(`Hardy in zone ${c.zone} (to zone ${d.minZone})`) }
  const showy = d.flowerConspicuous !== false
  if (yard) {
    const gaps = showy ? d.bloomMonths.filter((m) => BLOOM_SEASON.includes(m) && !yard.bloomMonths.has(m)) : []
    if (gaps.length) {
      score += Math.min(20, gaps.length * 10)
      reasons?.push(`Blooms in ${gaps.map((m) => MONTH_NAMES[m - 1]).join(' and ')}, when nothing native in your yard does`)
    }
    if (!yard.layers.has(d.layer)) { score += 15; reasons?.push(`Adds the ${d.layer === 'ground' ? 'ground' : d.layer} layer your yard lacks`) }
  } else if (showy && d.bloomMonths.length) {
    score += 5
    reasons?.push(`Blooms in ${d.bloomMonths.map((m) => MONTH_NAMES[m - 1]).join(', ')}`)
  }
  if (d.wildlife.includes('seed or fruit for birds')) { score += 8; reasons?.push('Seed or fruit for birds') }
  if (d.wildlife.includes('flowers for pollinators')) { score += 7; reasons?.push('Flowers for bees and butterflies') }
  if (d.commercialAvailability === 'Routinely Available') { score += 10; reasons?.push('Available from nurseries') }
  if (d.estimated.includes('spread')) reasons?.push('Mature spread is an estimate')
  return Math.min(100, score)
}

export function fitItem(s: CachedSpecies, status: RegionStatus, score: number, reasons: string[]): FitItem {
  const d = s.data
  return {
    scientificName: d.scientificName, commonName: d.commonName, layer: d.layer, spread: d.spread, height: d.height,
    spacing: d.spacing, minZone: d.minZone, sun: d.sun, soil: d.soil, moisture: d.moisture, bloomMonths: d.bloomMonths,
    toxic: d.toxic, estimated: d.estimated, status, score, reasons,
  }
}

export interface RegionFits {
  /** the region's natives, best first by the score parts no request changes (bloom, wildlife, nurseries), then name */
  natives: CachedSpecies[]
  base: Int16Array
  answers: Lru<string, FitItem[]>
}

export function buildRegionFits(statuses: Map<number, RegionStatus>, byId: Map<number, CachedSpecies>): RegionFits {
  const scored: { s: CachedSpecies; base: number }[] = []
  for (const [id, status] of statuses) {
    const s = status === 'native' ? byId.get(id) : undefined
    if (s) scored.push({ s, base: scoreFit(s, { region: '' }, null) })
  }
  scored.sort((a, b) => b.base - a.base || byCodeUnits(a.s.data.scientificName, b.s.data.scientificName))
  // per region: a few dozen answers of up to 200 items each
  return { natives: scored.map((x) => x.s), base: Int16Array.from(scored, (x) => x.base), answers: new Lru(32) }
}

const byScoreThenName = (a: { s: CachedSpecies; score: number }, b: { s: CachedSpecies; score: number }) =>
  b.score - a.score || byCodeUnits(a.s.data.scientificName, b.s.data.scientificName)

function withReasons(s: CachedSpecies, c: FitConditions, yard: YardContext | null, score: number, first: string[] = []): FitItem {
  scoreFit(s, c, yard, first)
  return fitItem(s, 'native', score, first)
}

/** Every native passing the filters, scored and sorted: the straightforward ranking the fast path must agree with. */
function rankAll(rf: RegionFits, c: FitConditions, yard: YardContext | null, zoneIdx: number | null, limit: number): FitItem[] {
  const scored: { s: CachedSpecies; score: number }[] = []
  for (const s of rf.natives) if (passes(s, 'native', c, zoneIdx)) scored.push({ s, score: scoreFit(s, c, yard) })
  scored.sort(byScoreThenName)
  return scored.slice(0, limit).map(({ s, score }) => withReasons(s, c, yard, score))
}

/**
 * Native species that fit a spot, best first (score, then name). Without a yard every passing species gets the
 * same points from the request (site, zone), so the pre-ranked natives are already in score order and the first
 * `limit` that pass are the answer; a yard's gaps differ per species, so then all passing natives are scored.
 */
export function rankFits(rf: RegionFits, c: FitConditions, yard: YardContext | null, limit = 50): FitItem[] {
  const key = JSON.stringify([c.zone ?? '', c.sun ?? '', c.soil ?? '', c.moisture ?? '', c.layer ?? '', c.maxSpread ?? '', limit,
    yard ? [[...yard.bloomMonths].sort((a, b) => a - b), [...yard.layers].sort()] : null])
  const cached = rf.answers.get(key)
  if (cached) return cached
  const zoneIdx = zoneIndex(c.zone)
  let items: FitItem[] | null = null
  if (!yard && (!c.zone || zoneIdx !== null)) {
    const picked: number[] = []
    for (let k = 0; k < rf.natives.length && picked.length < limit; k++) if (passes(rf.natives[k]!, 'native', c, zoneIdx)) picked.push(k)
    items = picked.map((k) => {
      const reasons: string[] = []
      return fitItem(rf.natives[k]!, 'native', scoreFit(rf.natives[k]!, c, null, reasons), reasons)
    })
    // the request's points must be the same for all (and no score capped at 100), else rank the long way
    const extra = items.length ? items[0]!.score - rf.base[picked[0]!]! : 0
    if (items.some((it, j) => it.score >= 100 || it.score - rf.base[picked[j]!]! !== extra)) items = null
  }
  items ??= rankAll(rf, c, yard, zoneIdx, limit)
  rf.answers.set(key, items)
  return items
}

/** Natives of the target's layer and similar size (half to twice its height) that fit the same spot, best first. */
export function rankSwaps(rf: RegionFits, target: CachedSpecies, c: Omit<FitConditions, 'layer' | 'maxSpread'>, limit = 20): FitItem[] {
  const zoneIdx = zoneIndex(c.zone)
  const h0 = target.data.height
  const cond: FitConditions = { ...c, layer: target.data.layer }
  const scored: { s: CachedSpecies; score: number }[] = []
  for (const s of rf.natives) {
    if (!passes(s, 'native', cond, zoneIdx)) continue
    const ratio = s.data.height / h0
    if (ratio < 0.5 || ratio > 2) continue
    const closeness = Math.round(20 * (1 - Math.abs(Math.log2(ratio))))
    scored.push({ s, score: Math.min(100, scoreFit(s, cond, null) + closeness) })
  }
  scored.sort(byScoreThenName)
  return scored.slice(0, limit).map(({ s, score }) =>
    withReasons(s, cond, null, score, [`Same layer (${s.data.layer}) and similar size: ${s.data.height} m tall, against ${h0} m`]))
}
