// Every rule that turns USDA PLANTS exports into Wildward's catalogue, in one place so each can be tested and
// read. The build script (scripts/build-catalogue.ts) only reads files and calls these; the server reuses the
// zone and status helpers. Sources: USDA NRCS PLANTS Database (public domain), files described in
// ../shared/data/usda-plants/README.md; the USDA 2023 Plant Hardiness Zone Map for the zone table.
import type { Layer, Moisture, RegionStatus, Soil, Sun } from '../types/species'
import { REGIONS } from './regions'
import { nameKey } from './species-name'
import { seedlingsPerPotFor } from './seed-size'

export const USDA = 'USDA PLANTS'
export const COORDINATOR = 'coordinator'
export const FROM_MEMORY = 'from memory'
/** Prefix of every default's `source`: the words after it say which rule gave the value. */
export const ESTIMATED = 'estimated'

// ---------------------------------------------------------------------------------------------------------
// Regions: the distribution file names states and provinces in full; we use ISO 3166-2 codes.

/** Names used by the distribution file that are not in REGIONS under the same spelling. */
const EXTRA_STATE_NAMES: Record<string, string> = {
  // USDA lists the two parts of one province separately
  Newfoundland: 'CA-NL',
  Labrador: 'CA-NL',
  // Navassa is one of the U.S. Minor Outlying Islands in ISO 3166
  'Navassa Island': 'US-UM',
}

const CODE_BY_NAME: Record<string, string> = Object.fromEntries(Object.entries(REGIONS).map(([code, name]) => [name, code]))

/** ISO 3166-2 code for a state name in the distribution file, or null when we do not know it. */
export function regionCodeForStateName(name: string): string | null {
  const n = name.trim()
  return EXTRA_STATE_NAMES[n] ?? CODE_BY_NAME[n] ?? null
}

/**
 * Which of USDA's native-status areas speaks for a region. USDA gives native status per area, not per state:
 * the lower 48 (with DC) as a whole, Alaska, Hawaii, Puerto Rico, the Virgin Islands, Canada as a whole.
 * Pacific islands and minor outlying islands have no area code in the file: null (see regionStatus).
 */
export function usdaAreaForRegion(code: string): 'L48' | 'AK' | 'HI' | 'PR' | 'VI' | 'CAN' | null {
  if (code.startsWith('CA-')) return 'CAN'
  switch (code) {
    case 'US-AK': return 'AK'
    case 'US-HI': return 'HI'
    case 'US-PR': return 'PR'
    case 'US-VI': return 'VI'
    case 'US-GU': case 'US-AS': case 'US-MP': case 'US-UM': case 'US-PW': case 'US-MH': case 'US-FM': return null
    default: return code.startsWith('US-') ? 'L48' : null
  }
}

export type AreaStatus = 'N' | 'I' | 'NI'

/**
 * Parses USDA's run-together native status, e.g. `L48(I,N)AK(NI)HI(I)CAN(N)`. N native; I introduced; both
 * (written `I,N` or `NI`) is its own status; W (waif) and GP (garden persistent) are introduced plants that do
 * not or barely persist, so count as introduced; a trailing `?` (USDA unsure) is read as the letter it qualifies.
 */
export function parseNativeStatus(text: string): Record<string, AreaStatus> {
  const out: Record<string, AreaStatus> = {}
  for (const m of text.matchAll(/([A-Z0-9]+)\(([^)]*)\)/g)) {
    const letters = m[2]!.replace(/\?/g, '')
    const hasN = /N/.test(letters.replace(/GP/g, ''))
    const hasI = /I|W|GP/.test(letters)
    out[m[1]!] = hasN && hasI ? (/I/.test(letters) ? 'NI' : 'N') : hasN ? 'N' : 'I'
  }
  return out
}

/**
 * A species' status in one region:
 * - absent when USDA does not record it there (distribution file);
 * - else from the USDA area code: N native, both nativeAndIntroduced, I introduced; no code for that area
 *   (USDA says nothing for it) → introduced, as USDA only codes where it has evidence of nativity;
 * - areas without any code family (Pacific islands, minor outlying islands) and species with no native-status
 *   row at all fall back to the distribution file's species-level status column (flagged by the caller);
 * - invasive when a state noxious list (or the federal list, for US regions) names it and it is not plain
 *   native there: a native that a state lists as a weed stays native and gets a caution instead.
 */
export function regionStatus(input: {
  region: string
  recorded: boolean
  areaStatus: Record<string, AreaStatus> | null
  distributionStatus?: 'native' | 'introduced' | 'both' | null
  noxious: boolean
}): RegionStatus {
  if (!input.recorded) return 'absent'
  const area = usdaAreaForRegion(input.region)
  let status: RegionStatus
  const fromDistribution = () => input.distributionStatus === 'both' ? 'nativeAndIntroduced' : input.distributionStatus === 'native' ? 'native' : 'introduced'
  if (!input.areaStatus || !area) status = fromDistribution()
  else {
    const code = input.areaStatus[area]
    status = code === 'N' ? 'native' : code === 'NI' ? 'nativeAndIntroduced' : 'introduced'
  }
  if (input.noxious && status !== 'native') return 'invasive'
  return status
}

/**
 * State noxious status as in the 2015 composite list: `CT (INB), MA (P), OR (BDW, Q)` → ['US-CT', 'US-MA', 'US-OR'].
 * Only two-letter US postal codes appear; unknown ones are dropped.
 */
export function parseNoxiousStates(text: string): string[] {
  const out = new Set<string>()
  for (const m of text.matchAll(/\b([A-Z]{2})\s*\(/g)) {
    const code = `US-${m[1]}`
    if (REGIONS[code]) out.add(code)
  }
  return [...out]
}

// ---------------------------------------------------------------------------------------------------------
// Names: the files share no key between `plants` (names with authors) and the native-status codes (bare names).

const RANK_WORDS = new Set(['ssp.', 'var.', 'f.', 'subsp.'])

/**
 * The bare name of a USDA name with authors: genus + epithet [+ rank + infraspecific epithet], hybrid sign
 * written `×` attached (USDA PLANTS style) or `X` spaced (native-status file style) both become `×`, glued.
 * `Poa pratensis L. ssp. pratensis ` → `Poa pratensis ssp. pratensis`; `Abelia X grandiflora` → `Abelia ×grandiflora`;
 * `Ulmus pumila × rubra [unnamed hybrid]` → `Ulmus pumila ×rubra`.
 * Trailing footnote digits (noxious list: `Ambrosia trifida L.1`) sit in the author and are dropped with it.
 */
export function bareName(withAuthor: string): string {
  const cleaned = withAuthor.replace(/\[[^\]]*\]/g, ' ').replace(/\s+X\s+/g, ' ×').replace(/\s+×\s+/g, ' ×').trim()
  const tokens = cleaned.split(/\s+/)
  const out: string[] = []
  // a nothogenus written with a capital X glued on (native-status file: `XAchnella caduca`) is `×Achnella`
  const genus = tokens[0]?.replace(/^X(?=[A-Z][a-z])/, '×')
  if (!genus) return ''
  out.push(genus)
  const epithet = tokens[1]
  if (epithet && /^×?[a-z][a-z.-]*$/.test(epithet)) out.push(epithet)
  else return out.join(' ')
  // a rank word is never an epithet: in `Burm. f. var. diffusa` the `f.` ends the author (filius), not a forma
  const epithetLike = (t: string | undefined) => !!t && /^×?[a-z][a-z.-]*$/.test(t) && !['ex', 'in', 'et'].includes(t) && !RANK_WORDS.has(t)
  for (let i = 2; i < tokens.length; i++) {
    const t = tokens[i]!
    if ((RANK_WORDS.has(t) || /^×(ssp\.|var\.|f\.)$/.test(t)) && epithetLike(tokens[i + 1])) {
      // every rank pair is kept: USDA has quadrinomials (ssp. … var. …) and hybrid formulas (ssp. a × ssp. b)
      out.push(t === 'subsp.' ? 'ssp.' : t, tokens[i + 1]!)
      i++
    } else if (/^×[a-z][a-z.-]*$/.test(t)) {
      // a hybrid formula (Ulmus pumila × rubra) names a taxon of its own, not the first parent
      out.push(t)
    }
  }
  return out.join(' ')
}

/** The species part of a bare name: `Poa pratensis ssp. pratensis` → `Poa pratensis`. */
export function speciesOf(bare: string): string {
  return bare.split(' ').slice(0, 2).join(' ')
}

// ---------------------------------------------------------------------------------------------------------
// Layer from growth habit. USDA PLANTS lists several habits per taxon in alphabetical order, so order says
// nothing; USDA's own definitions separate tree from shrub at about 4 to 5 m (13 to 16 ft), single stem.

export const TREE_MIN_HEIGHT_FT = 13

export function layerFromHabit(habit: string | null | undefined, heightFt: number | null): Layer | null {
  const h = new Set((habit ?? '').split(',').map((s) => s.trim()).filter(Boolean))
  if (h.has('Tree') && h.has('Shrub')) return heightFt !== null && heightFt >= TREE_MIN_HEIGHT_FT ? 'tree' : 'shrub'
  if (h.has('Tree')) return 'tree'
  if (h.has('Shrub')) return 'shrub'
  // a herb that USDA also calls a subshrub (woody only at the base: wild bergamot, many asters) grows and is
  // planted as a perennial, so the ground layer; a plain subshrub is a small shrub
  if (h.has('Subshrub')) return h.has('Forb/herb') || h.has('Graminoid') ? 'ground' : 'shrub'
  if (h.has('Forb/herb') || h.has('Graminoid') || h.has('Vine')) return 'ground'
  return null
}

// ---------------------------------------------------------------------------------------------------------
// Site: sun, moisture, soil. USDA rates tolerances, not needs, so each maps to the conditions a plant takes.

/** Shade tolerance: Intolerant → full sun only; Intermediate → full or part; Tolerant → any (tolerates shade). */
export function sunFromShadeTolerance(v: string | null | undefined): Sun[] {
  switch ((v ?? '').trim()) {
    case 'Intolerant': return ['full']
    case 'Intermediate': return ['full', 'part']
    case 'Tolerant': return ['full', 'part', 'shade']
    default: return []
  }
}

/**
 * Moisture the plant takes:
 * - dry when drought tolerance is High, or Medium with moisture use not High;
 * - medium for every rated plant except true wetland plants (anaerobic tolerance High and drought tolerance None);
 * - wet when anaerobic tolerance (of waterlogged soil) is Medium or High, or moisture use High with some
 *   anaerobic tolerance (Low).
 */
export function moistureFrom(use: string | null | undefined, drought: string | null | undefined, anaerobic: string | null | undefined): Moisture[] {
  const u = (use ?? '').trim(), d = (drought ?? '').trim(), a = (anaerobic ?? '').trim()
  if (!u && !d && !a) return []
  const out: Moisture[] = []
  if (d === 'High' || (d === 'Medium' && u !== 'High')) out.push('dry')
  if (!(a === 'High' && d === 'None')) out.push('medium')
  if (a === 'High' || a === 'Medium' || (u === 'High' && a === 'Low')) out.push('wet')
  return out
}

/** Soil texture flags: coarse → sand, medium → loam, fine → clay. */
export function soilFromTextures(coarse: unknown, medium: unknown, fine: unknown): Soil[] {
  const out: Soil[] = []
  if (usdaTrue(coarse)) out.push('sand')
  if (usdaTrue(medium)) out.push('loam')
  if (usdaTrue(fine)) out.push('clay')
  return out
}

// ---------------------------------------------------------------------------------------------------------
// Bloom: USDA's season words to calendar months (northern temperate reading: spring = Mar–May, summer = Jun–Aug,
// fall = Sep–Nov, winter = Dec–Feb; early/mid/late take one month each). Indeterminate → none.

const BLOOM: Record<string, number[]> = {
  'Early Spring': [3], 'Mid Spring': [4], 'Late Spring': [5], Spring: [3, 4, 5],
  'Early Summer': [6], 'Mid Summer': [7], 'Late Summer': [8], Summer: [6, 7, 8],
  'Early Fall': [9], 'Mid Fall': [10], 'Late Fall': [11], Fall: [9, 10, 11],
  'Early Winter': [12], 'Mid Winter': [1], 'Late Winter': [2], Winter: [12, 1, 2],
}
export function bloomMonthsFrom(period: string | null | undefined): number[] {
  return [...(BLOOM[(period ?? '').trim()] ?? [])]
}

// ---------------------------------------------------------------------------------------------------------
// Hardiness zone, USDA 2023 map: zone 1a starts at −60 °F, each half-zone spans 5 °F (a zone 10 °F), up to
// 13b (65–70 °F). Our assumption, stated: a lower bound belongs to its zone (−35 °F is 3b, −30 °F is 4a), and
// a plant's coldest zone is the half-zone containing its minimum temperature.

export const ZONE_BASE_F = -60
export const HALF_ZONE_F = 5
export const HALF_ZONES = 26

/** Half-zone index 0 (1a) … 25 (13b) → "1a" … "13b". */
export function zoneName(index: number): string {
  const i = Math.max(0, Math.min(HALF_ZONES - 1, index))
  return `${Math.floor(i / 2) + 1}${i % 2 ? 'b' : 'a'}`
}

/** "6a" → 10; null for anything else. */
export function zoneIndex(zone: string | null | undefined): number | null {
  const m = /^(1[0-3]|[1-9])([ab])$/.exec((zone ?? '').trim())
  if (!m) return null
  return (Number(m[1]) - 1) * 2 + (m[2] === 'b' ? 1 : 0)
}

/** Coldest zone for a minimum temperature in °F; colder than 1a clamps to 1a, warmer than 13b to 13b. */
export function zoneFromMinTemperatureF(t: number): string {
  return zoneName(Math.floor((t - ZONE_BASE_F) / HALF_ZONE_F))
}

// ---------------------------------------------------------------------------------------------------------
// Other USDA facts.

export function usdaTrue(v: unknown): boolean {
  return v === true || (typeof v === 'string' && v.trim().toUpperCase() === 'TRUE')
}

/** TRUE/FALSE → boolean, blank → null (unknown). */
export function boolOrNull(v: unknown): boolean | null {
  if (v === true || v === false) return v
  const s = typeof v === 'string' ? v.trim().toUpperCase() : ''
  return s === 'TRUE' ? true : s === 'FALSE' ? false : null
}

/** "7e+05" or "250000" → number; blank or nonsense → null. */
export function numberOrNull(v: unknown): number | null {
  if (v === null || v === undefined) return null
  const s = String(v).trim()
  if (!s || s === 'NA') return null
  const n = Number(s)
  return Number.isFinite(n) ? n : null
}

/** Toxicity None → not toxic; Slight/Moderate/Severe → toxic with that word; blank → unknown. */
export function toxicityFrom(v: string | null | undefined): { toxic: boolean; toxicity: string | null } {
  const s = (v ?? '').trim()
  if (!s) return { toxic: false, toxicity: null }
  if (s === 'None') return { toxic: false, toxicity: 'none' }
  return { toxic: true, toxicity: s.toLowerCase() }
}

/** Wildlife value in plain words, from the facts USDA has (no host-plant data in PLANTS). */
export function wildlifeFrom(c: { fruitSeedAbundance?: string | null; flowerConspicuous?: unknown; berryNutSeed?: unknown }): string[] {
  const out: string[] = []
  const abundance = (c.fruitSeedAbundance ?? '').trim()
  if (abundance === 'High' || abundance === 'Medium' || usdaTrue(c.berryNutSeed)) out.push('seed or fruit for birds')
  // conspicuous flowers are, as a rule, insect-pollinated (common practice), so they offer nectar and pollen
  if (usdaTrue(c.flowerConspicuous)) out.push('flowers for pollinators')
  return out
}

export const ROUTINELY_AVAILABLE = 'Routinely Available'

// ---------------------------------------------------------------------------------------------------------
// Defaults for what USDA lacks, by layer and size. Each is marked estimated and carries its rule as `source`.
// Values are common horticultural practice, recalled rather than taken from one published table ("from memory").

const FT = 0.3048

/** Mature height when USDA has none (m): a typical yard tree, shrub and perennial. */
export const DEFAULT_HEIGHT_M: Record<Layer, number> = { tree: 15, shrub: 2, ground: 0.6 }

/**
 * Mature spread from height (m): an open-grown tree's crown about two-thirds of its height (at least 3 m);
 * a shrub about as wide as tall (0.5–6 m); a perennial or grass about 0.6 × its height (0.25–1.2 m), wider when
 * USDA rates its vegetative spread Moderate or Rapid (× 1.5).
 */
export function defaultSpreadM(layer: Layer, heightM: number, vegetativeSpread?: string | null): number {
  const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v))
  let s: number
  if (layer === 'tree') s = Math.max(3, heightM * 0.67)
  else if (layer === 'shrub') s = clamp(heightM, 0.5, 6)
  else {
    s = clamp(heightM * 0.6, 0.25, 1.2)
    if (vegetativeSpread === 'Moderate' || vegetativeSpread === 'Rapid') s = Math.min(1.8, s * 1.5)
  }
  return roundToCm(s)
}

/** On-centre spacing for drifts and massings: the spread (plants just touching at maturity); turf is sown: null. */
export function defaultSpacingM(spreadM: number, lawn: boolean): number | null {
  return lawn ? null : roundToCm(spreadM)
}

/** Days of cold-moist stratification when USDA says a cold period is needed: woody plants 90, others 60. */
export function defaultColdMoistDays(layer: Layer, coldStratification: boolean | null): number | null {
  if (coldStratification === null) return null
  if (!coldStratification) return 0
  return layer === 'ground' ? 60 : 90
}

/** Dust-fine seed (a million or more per pound) is surface-sown: it needs light to germinate. */
export function defaultSeedNeedsLight(seedsPerPound: number | null): boolean {
  return seedsPerPound !== null && seedsPerPound >= 1_000_000
}

/** Hard-coated seed: legumes (Fabaceae) want scarifying; woody legumes and Ceanothus a hot-water soak. */
export function defaultSeedCoat(family: string | null, genus: string | null, layer: Layer): { scarify: boolean; hotWaterSoak: boolean } {
  const legume = family === 'Fabaceae'
  return { scarify: legume, hotWaterSoak: (legume && layer !== 'ground') || genus === 'Ceanothus' }
}

/** Seedlings one 10 cm (4-inch) pot gives when sown and pricked out: the seed-size rule (shared/utils/seed-size.ts). */
export function defaultSeedlingsPerPot(layer: Layer, seedsPerPound: number | null): number {
  return seedlingsPerPotFor(layer, seedsPerPound)
}

/** Turf grasses whose area is lawn (common practice list of North American lawn species, native buffalograss included). */
export const LAWN_SPECIES = new Set([
  'poa pratensis', 'poa trivialis', 'poa annua', 'lolium perenne', 'schedonorus arundinaceus', 'festuca arundinacea',
  'festuca rubra', 'festuca trachyphylla', 'festuca brevipila', 'agrostis stolonifera', 'agrostis capillaris',
  'cynodon dactylon', 'zoysia japonica', 'zoysia matrella', 'stenotaphrum secundatum', 'paspalum notatum',
  'eremochloa ophiuroides', 'bouteloua dactyloides', 'buchloe dactyloides',
])

export function isLawnSpecies(bare: string): boolean {
  return LAWN_SPECIES.has(speciesOf(nameKey(bare)))
}

export function roundToCm(v: number): number {
  return Math.round(v * 100) / 100
}

export function feetToMetres(ft: number): number {
  return roundToCm(ft * FT)
}

// ---------------------------------------------------------------------------------------------------------
// One catalogue entry, derived from a plants row, its characteristics row (if any) and its statuses.

/** The committed catalogue's record of one taxon (short keys would save little after gzip; names are kept). */
export interface CatalogueEntry {
  scientificName: string
  /** the accepted name with its authors, as USDA PLANTS writes it */
  usdaName: string | null
  commonName: string | null
  symbol: string
  family: string | null
  genus: string | null
  growthHabit: string | null
  duration: string | null
  layer: Layer
  height: number
  spread: number
  spacing: number | null
  lawn: boolean
  sun: Sun[]
  moisture: Moisture[]
  soil: Soil[]
  bloomMonths: number[]
  flowerConspicuous: boolean | null
  minTemperatureF: number | null
  minZone: string | null
  toxic: boolean
  toxicity: string | null
  propagatedBySeed: boolean | null
  coldStratification: boolean | null
  coldMoistDays: number | null
  seedNeedsLight: boolean | null
  scarify: boolean
  hotWaterSoak: boolean
  /** seed that dies when dried: set only by a coordinator; absent → the default list (shared/utils/seed-fresh.ts) */
  sowFresh?: boolean | null
  seedsPerPound: number | null
  seedlingsPerPot: number | null
  commercialAvailability: string | null
  wildlife: string[]
  /** regions where a state (or the federal) noxious list of 2015 names it */
  noxiousIn: string[]
  /** status per ISO 3166-2 region where USDA records it (absent regions are left out) */
  regions: Record<string, Exclude<RegionStatus, 'absent'>>
  hasCharacteristics: boolean
  /** field → where the value came from */
  sources: Record<string, string>
  /** fields whose value is a default, not data */
  estimated: string[]
}

/** A characteristics row as read from plant_characteristics.csv (strings as in the file). */
export type CharacteristicsRow = Record<string, string | undefined>

/** The facts of an entry from its USDA rows; statuses and noxious regions are added by the caller. */
export function deriveFacts(plant: { scientificName: string; family: string | null; genus: string | null; growthHabit: string | null }, c: CharacteristicsRow | null) {
  const sources: Record<string, string> = {}
  const estimated: string[] = []
  const usda = (field: string) => { sources[field] = USDA }
  const est = (field: string, rule: string) => { sources[field] = `${ESTIMATED}: ${rule}`; estimated.push(field) }

  const heightFt = c ? numberOrNull(c.height_mature_feet) : null
  let layer = layerFromHabit(plant.growthHabit, heightFt)
  if (layer) usda('layer')
  else { layer = 'ground'; est('layer', 'no growth habit in USDA PLANTS; ground layer assumed') }

  let height: number
  if (heightFt !== null && heightFt > 0) { height = feetToMetres(heightFt); usda('height') }
  else { height = DEFAULT_HEIGHT_M[layer]; est('height', `typical ${layer} height`) }

  const lawn = isLawnSpecies(plant.scientificName)
  const spread = lawn ? 0.1 : defaultSpreadM(layer, height, c?.vegetative_spread_rate)
  est('spread', lawn ? 'turf grass' : `${layer} default from height`)
  const spacing = defaultSpacingM(spread, lawn)
  est('spacing', lawn ? 'turf is sown or sodded' : 'spread (plants touching at maturity)')

  const sun = c ? sunFromShadeTolerance(c.shade_tolerance) : []
  if (sun.length) usda('sun')
  const moisture = c ? moistureFrom(c.moisture_use, c.drought_tolerance, c.anaerobic_tolerance) : []
  if (moisture.length) usda('moisture')
  const soil = c ? soilFromTextures(c.adapted_to_coarse_textured_soils, c.adapted_to_medium_textured_soils, c.adapted_to_fine_textured_soils) : []
  if (c) usda('soil')
  const bloomMonths = c ? bloomMonthsFrom(c.bloom_period) : []
  if (bloomMonths.length) usda('bloomMonths')
  const minTemperatureF = c ? numberOrNull(c.temperature_minimum_f) : null
  const minZone = minTemperatureF !== null ? zoneFromMinTemperatureF(minTemperatureF) : null
  if (minZone) usda('minZone')
  const tox = toxicityFrom(c?.toxicity)
  if (tox.toxicity) usda('toxicity')

  const propagatedBySeed = c ? boolOrNull(c.propagated_by_seed) : null
  const coldStratification = c ? boolOrNull(c.cold_stratification_required) : null
  if (propagatedBySeed !== null) usda('propagatedBySeed')
  if (coldStratification !== null) usda('coldStratification')
  const coldMoistDays = defaultColdMoistDays(layer, coldStratification)
  // no cold period is USDA's own answer (0 days); a needed one has no length in USDA, so its days are a default
  if (coldMoistDays === 0) usda('coldMoistDays')
  else if (coldMoistDays !== null) est('coldMoistDays', `${layer === 'ground' ? 'herbaceous' : 'woody'} plants needing a cold period`)
  const seedsPerPound = c ? numberOrNull(c.seed_per_pound) : null
  if (seedsPerPound !== null) usda('seedsPerPound')
  const seedNeedsLight = defaultSeedNeedsLight(seedsPerPound)
  est('seedNeedsLight', 'dust-fine seed (≥ 1,000,000 per pound) is surface-sown')
  const coat = defaultSeedCoat(plant.family, plant.genus, layer)
  est('scarify', 'hard-coated legume seed'); est('hotWaterSoak', 'woody legumes and Ceanothus')
  const seedlingsPerPot = defaultSeedlingsPerPot(layer, seedsPerPound)
  est('seedlingsPerPot', `10 cm pot, ${layer} default by seed size`)
  const commercialAvailability = c?.commercial_availability?.trim() || null
  if (commercialAvailability) usda('commercialAvailability')
  const wildlife = c ? wildlifeFrom({ fruitSeedAbundance: c.fruit_seed_abundance, flowerConspicuous: c.flower_conspicuous, berryNutSeed: c.berry_nut_seed_product }) : []
  if (wildlife.length) usda('wildlife')

  return {
    layer, height, spread, spacing, lawn, sun, moisture, soil, bloomMonths,
    flowerConspicuous: c ? boolOrNull(c.flower_conspicuous) : null,
    minTemperatureF, minZone, toxic: tox.toxic, toxicity: tox.toxicity,
    propagatedBySeed, coldStratification, coldMoistDays, seedNeedsLight, scarify: coat.scarify, hotWaterSoak: coat.hotWaterSoak,
    seedsPerPound, seedlingsPerPot, commercialAvailability, wildlife, hasCharacteristics: !!c, sources, estimated,
  }
}

type Refreshable = Pick<CatalogueEntry, 'layer' | 'height' | 'spread' | 'spacing' | 'lawn' | 'coldStratification' | 'coldMoistDays'
  | 'seedsPerPound' | 'seedNeedsLight' | 'seedlingsPerPot' | 'scarify' | 'hotWaterSoak' | 'family' | 'genus' | 'sources' | 'estimated'>

/**
 * After a coordinator changes some facts, recomputes the defaults that depend on them (only values still
 * marked estimated, or derived from a USDA flag, are touched): layer → height; height → spread → spacing;
 * cold period → its days; seeds per pound → seed light and seedlings per pot.
 */
export function refreshEstimates(d: Refreshable, changed: Iterable<string>) {
  const c = new Set(changed)
  const est = (f: string) => d.estimated.includes(f)
  const mark = (f: string, rule: string) => { d.sources[f] = `${ESTIMATED}: ${rule}`; if (!est(f)) d.estimated.push(f) }
  if (c.has('layer') && est('height')) { d.height = DEFAULT_HEIGHT_M[d.layer]; c.add('height') }
  if ((c.has('height') || c.has('layer')) && est('spread')) { d.spread = d.lawn ? 0.1 : defaultSpreadM(d.layer, d.height); c.add('spread') }
  if (c.has('spread') && est('spacing')) d.spacing = defaultSpacingM(d.spread, d.lawn)
  if ((c.has('coldStratification') || c.has('layer')) && (est('coldMoistDays') || d.sources.coldMoistDays === USDA || d.coldMoistDays === null)) {
    d.coldMoistDays = defaultColdMoistDays(d.layer, d.coldStratification)
    d.estimated = d.estimated.filter((f) => f !== 'coldMoistDays')
    if (d.coldMoistDays === 0) d.sources.coldMoistDays = USDA
    else if (d.coldMoistDays !== null) mark('coldMoistDays', `${d.layer === 'ground' ? 'herbaceous' : 'woody'} plants needing a cold period`)
  }
  if (c.has('seedsPerPound') && est('seedNeedsLight')) d.seedNeedsLight = defaultSeedNeedsLight(d.seedsPerPound)
  if ((c.has('seedsPerPound') || c.has('layer')) && est('seedlingsPerPot')) d.seedlingsPerPot = defaultSeedlingsPerPot(d.layer, d.seedsPerPound)
  if (c.has('layer')) {
    const coat = defaultSeedCoat(d.family, d.genus, d.layer)
    if (est('scarify')) d.scarify = coat.scarify
    if (est('hotWaterSoak')) d.hotWaterSoak = coat.hotWaterSoak
  }
}
