// Good fits and swaps over one in-memory catalogue copy (pure: no database, no Nitro auto-imports). A region's
// natives are offered in two groups: those whose recorded sun, soil, moisture and hardiness fit the spot, and
// below them those whose site needs are not recorded (USDA has growing facts for about a third of natives), with
// the reason in words. Each fit carries a score out of 100, reasons in words about that plant, and the source of
// each fact it shows.
import type { Layer, RegionStatus } from '#shared/types/species'
import { zoneIndex } from '#shared/utils/catalogue-rules'
import { sourceLabel } from '#shared/utils/fact-source'
import { compareNames } from '#shared/utils/species-name'
import type { CachedSpecies } from './catalogue-index'

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

/** `known`: its recorded facts fit the spot; `unrecorded`: some site need (or hardiness) is not recorded. */
export type FitGroup = 'known' | 'unrecorded'

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
  fit: FitGroup
  /** 0–100 */
  score: number
  reasons: string[]
  /** where each shown fact comes from, in words: USDA PLANTS · estimated · estimated from its native range · your organization's list */
  sources: Record<'height' | 'spread' | 'minZone' | 'sun' | 'soil' | 'moisture' | 'bloomMonths', string>
}

export const FIT_SCALE = 100
export const UNRECORDED_REASON = 'Site needs not recorded — check your regional list'
const MONTH_NAMES = ['January', 'February', 'March', 'April', 'May', 'June', 'July', 'August', 'September', 'October', 'November', 'December']
// the months a yard shows bloom in (northern temperate growing season)
export const BLOOM_SEASON = [3, 4, 5, 6, 7, 8, 9, 10]
const SUN_WORDS: Record<string, string> = { full: 'full sun', part: 'part shade', shade: 'shade' }
const SOIL_WORDS: Record<string, string> = { sand: 'sandy', loam: 'loamy', clay: 'clay' }
const MOISTURE_WORDS: Record<string, string> = { dry: 'dry', medium: 'medium', wet: 'wet' }

const joinList = (words: string[], last: string) => (words.length <= 1 ? words.join('') : `${words.slice(0, -1).join(', ')} ${last} ${words.at(-1)}`)
const orList = (words: string[]) => joinList(words, 'or')
const andList = (words: string[]) => joinList(words, 'and')
const monthRun = (months: number[]) => (months.length > 2 && months.every((m, k) => !k || m === months[k - 1]! + 1)
  ? `${MONTH_NAMES[months[0]! - 1]} to ${MONTH_NAMES[months.at(-1)! - 1]}` : andList(months.map((m) => MONTH_NAMES[m - 1]!)))

/**
 * Whether a native fits the spot: null when a recorded fact rules it out (not native, too tender, wrong layer,
 * too wide, or a recorded sun, soil or moisture that excludes the spot's); `unrecorded` when a condition asked
 * for is not recorded for it; else `known`.
 */
export function fitGroup(s: CachedSpecies, status: RegionStatus | undefined, c: FitConditions, zoneIdx: number | null): FitGroup | null {
  const d = s.data
  if (status !== 'native') return null
  if (c.layer && d.layer !== c.layer) return null
  if (c.maxSpread !== undefined && d.spread > c.maxSpread) return null
  let group: FitGroup = 'known'
  if (zoneIdx !== null) {
    if (s.minZoneIndex === null) group = 'unrecorded'
    else if (s.minZoneIndex > zoneIdx) return null
  }
  for (const [want, has] of [[c.sun, d.sun], [c.soil, d.soil], [c.moisture, d.moisture]] as const) {
    if (!want) continue
    if (!has.length) group = 'unrecorded'
    else if (!(has as readonly string[]).includes(want)) return null
  }
  return group
}

/** The conditions asked for that the species has no record of (sun, soil, moisture, hardiness). */
function unrecordedNeeds(s: CachedSpecies, c: FitConditions): string[] {
  const d = s.data
  const out: string[] = []
  if (c.sun && !d.sun.length) out.push('sun')
  if (c.soil && !d.soil.length) out.push('soil')
  if (c.moisture && !d.moisture.length) out.push('moisture')
  if (c.zone && s.minZoneIndex === null) out.push('cold hardiness')
  return out
}

/**
 * Score 0–100 from what is recorded: the spot's sun, soil and moisture it is known to take, hardiness (a USDA
 * record counts more than an estimate), a yard's bloom and layer gaps it fills, wildlife value, nursery supply.
 * The reasons, in words about this plant, are written into `reasons` when given (ranking thousands of natives
 * only words the ones shown).
 */
export function scoreFit(s: CachedSpecies, c: FitConditions, yard: YardContext | null, reasons?: string[]): number {
  const d = s.data
  let score = 0
  if (c.sun && d.sun.includes(c.sun as never)) score += 15
  if (c.soil && d.soil.includes(c.soil as never)) score += 10
  if (c.moisture && d.moisture.includes(c.moisture as never)) score += 10
  if (reasons) {
    const site: string[] = []
    if (d.sun.length) site.push(orList(d.sun.map((x) => SUN_WORDS[x]!)))
    if (d.soil.length) site.push(`${orList(d.soil.map((x) => SOIL_WORDS[x]!))} soil`)
    if (d.moisture.length) site.push(`${orList(d.moisture.map((x) => MOISTURE_WORDS[x]!))} ground`)
    const missing = unrecordedNeeds(s, c)
    if (site.length) reasons.push(`Takes ${site.join('; ')} (${sourceLabel(d.sources.sun ?? d.sources.soil)})`)
    if (missing.length) reasons.push(`${UNRECORDED_REASON} (${andList(missing)})`)
  }
  if (d.minZone) {
    const estimate = d.estimated.includes('minZone')
    if (c.zone) score += estimate ? 5 : 10
    reasons?.push(`Hardy to zone ${d.minZone}${c.zone ? ` (your yard: ${c.zone})` : ''}, ${sourceLabel(d.sources.minZone)}`)
  }
  const showy = d.flowerConspicuous !== false
  if (yard) {
    const gaps = showy ? d.bloomMonths.filter((m) => BLOOM_SEASON.includes(m) && !yard.bloomMonths.has(m)) : []
    if (gaps.length) {
      score += Math.min(20, gaps.length * 10)
      reasons?.push(`Blooms in ${monthRun(gaps)}, when nothing native in your yard does`)
    } else if (showy && d.bloomMonths.length) reasons?.push(`Blooms in ${monthRun(d.bloomMonths)}`)
    if (!yard.layers.has(d.layer)) { score += 15; reasons?.push(`Adds the ${d.layer} layer your yard lacks`) }
  } else if (showy && d.bloomMonths.length) {
    score += 5
    reasons?.push(`Blooms in ${monthRun(d.bloomMonths)}`)
  }
  const birds = d.wildlife.includes('seed or fruit for birds')
  const bees = d.wildlife.includes('flowers for pollinators')
  if (birds) score += 8
  if (bees) score += 7
  if (birds || bees) reasons?.push(birds && bees ? 'Seed or fruit for birds, flowers for bees and butterflies' : birds ? 'Seed or fruit for birds' : 'Flowers for bees and butterflies')
  if (d.commercialAvailability === 'Routinely Available') { score += 10; reasons?.push('Sold by most native nurseries') }
  else if (d.commercialAvailability === 'Field Collections Only' || d.commercialAvailability === 'No Known Source') reasons?.push('Hard to buy: look for seed or a plant sale')
  return Math.min(FIT_SCALE, score)
}

export function fitItem(s: CachedSpecies, status: RegionStatus, fit: FitGroup, score: number, reasons: string[]): FitItem {
  const d = s.data
  const src = (f: string) => sourceLabel(d.sources[f])
  return {
    scientificName: d.scientificName, commonName: d.commonName, layer: d.layer, spread: d.spread, height: d.height,
    spacing: d.spacing, minZone: d.minZone, sun: d.sun, soil: d.soil, moisture: d.moisture, bloomMonths: d.bloomMonths,
    toxic: d.toxic, estimated: d.estimated, status, fit, score, reasons,
    sources: { height: src('height'), spread: src('spread'), minZone: src('minZone'), sun: src('sun'), soil: src('soil'), moisture: src('moisture'), bloomMonths: src('bloomMonths') },
  }
}

/** A region's natives in name order, made once per region per catalogue copy. */
export interface RegionFits { natives: CachedSpecies[] }

export function buildRegionFits(statuses: Map<number, RegionStatus>, byId: Map<number, CachedSpecies>): RegionFits {
  const natives: CachedSpecies[] = []
  for (const [id, status] of statuses) {
    const s = status === 'native' ? byId.get(id) : undefined
    if (s) natives.push(s)
  }
  natives.sort((a, b) => compareNames(a.data.scientificName, b.data.scientificName))
  return { natives }
}

interface Scored { s: CachedSpecies; score: number }
// the natives are in name order and the sort is stable, so equal scores stay in name order
const byScore = (a: Scored, b: Scored) => b.score - a.score

function itemsOf(scored: Scored[], fit: FitGroup, c: FitConditions, yard: YardContext | null, first?: (s: CachedSpecies) => string[]): FitItem[] {
  return scored.map(({ s, score }) => {
    const reasons = first?.(s) ?? []
    scoreFit(s, c, yard, reasons)
    return fitItem(s, 'native', fit, score, reasons)
  })
}

export interface FitsAnswer {
  /** natives whose recorded facts fit, best first (one page) */
  items: FitItem[]
  /** reasons every one of `items` has, said once above them rather than on every card */
  shared: string[]
  /** natives with a site need or hardiness not recorded, best first (one page) */
  unrecorded: FitItem[]
  total: { known: number; unrecorded: number }
}

/** Removes the reasons all items have (when there are several) and returns them, so each card shows what sets it apart. */
function takeShared(items: FitItem[]): string[] {
  if (items.length < 2) return []
  const shared = items[0]!.reasons.filter((r) => items.every((i) => i.reasons.includes(r)))
  if (shared.length) for (const i of items) i.reasons = i.reasons.filter((r) => !shared.includes(r))
  return shared
}

/** Natives that fit a spot in two groups, each best first (score, then name), paged alike. */
export function rankFits(rf: RegionFits, c: FitConditions, yard: YardContext | null, limit = 50, page = 1): FitsAnswer {
  const zoneIdx = zoneIndex(c.zone)
  const known: Scored[] = []
  const unrecorded: Scored[] = []
  for (const s of rf.natives) {
    const g = fitGroup(s, 'native', c, zoneIdx)
    if (g) (g === 'known' ? known : unrecorded).push({ s, score: scoreFit(s, c, yard) })
  }
  known.sort(byScore)
  unrecorded.sort(byScore)
  const from = (page - 1) * limit
  const items = itemsOf(known.slice(from, from + limit), 'known', c, yard)
  return {
    items,
    shared: takeShared(items),
    unrecorded: itemsOf(unrecorded.slice(from, from + limit), 'unrecorded', c, yard),
    total: { known: known.length, unrecorded: unrecorded.length },
  }
}

/**
 * Natives of the target's layer and similar size (half to twice its height) that fit the same spot: those with
 * a known fit first, then those whose site needs are not recorded; each best first.
 */
export function rankSwaps(rf: RegionFits, target: CachedSpecies, c: Omit<FitConditions, 'layer' | 'maxSpread'>, limit = 20): FitItem[] {
  const zoneIdx = zoneIndex(c.zone)
  const h0 = target.data.height
  const cond: FitConditions = { ...c, layer: target.data.layer }
  const groups: Record<FitGroup, Scored[]> = { known: [], unrecorded: [] }
  for (const s of rf.natives) {
    const g = fitGroup(s, 'native', cond, zoneIdx)
    if (!g) continue
    const ratio = s.data.height / h0
    if (ratio < 0.5 || ratio > 2) continue
    const closeness = Math.round(20 * (1 - Math.abs(Math.log2(ratio))))
    groups[g].push({ s, score: Math.min(FIT_SCALE, scoreFit(s, cond, null) + closeness) })
  }
  const first = (s: CachedSpecies) => [`Same layer (${s.data.layer}) and a similar size: ${s.data.height} m tall, against ${h0} m`]
  const known = groups.known.sort(byScore).slice(0, limit)
  const rest = groups.unrecorded.sort(byScore).slice(0, limit - known.length)
  return [...itemsOf(known, 'known', cond, null, first), ...itemsOf(rest, 'unrecorded', cond, null, first)]
}
