/**
 * Grow from seed: every rule that turns a yard plan's native species into pots to sow, seed to buy, treatments
 * and dates, in this one file (no I/O). The server route feeds it the plan, the species facts and the settings;
 * the page, the calendar, the pot tags and the reminders all read what it returns.
 *
 * Rules (numbers are common practice for sowing natives in pots outdoors, unless a source is named):
 * - Plants needed: point plantings count their plants (1 unless a count is given); drifts count
 *   area ÷ (0.866 × spacing²), the triangular layout (shared/utils/plant-count.ts), rounded up per drift.
 * - Seedlings a 10 cm (4-inch) pot gives: 10 by default (such a pot of sown seed gives about 10–15); a species'
 *   own figure from the catalogue, then the plan's override, win. Very large seed (under 2,000 per pound:
 *   nuts, acorns, big legumes) is sown one seedling to a pot.
 * - Pots = ceil(plants × (1 + margin) ÷ seedlings per pot); the spare margin is 20 % unless the plan says.
 * - Seeds per pot by seed size (seeds per pound): dust-fine ≥ 1,000,000 → 60 (a pinch, most will not come up);
 *   small 200,000–999,999 → 40; medium 20,000–199,999 → 25; large 2,000–19,999 → 12; very large < 2,000 → 2;
 *   unknown size → 30 (marked as a guess). Grams = seeds × 453.59237 ÷ seeds per pound (the international
 *   pound is exactly 453.59237 g).
 * - Pre-treatment: a hard seed coat is scarified (nicked with sandpaper) or soaked in hot water first; seed that
 *   needs a cold period gets N days cold and moist at about 1–5 °C, outdoors over winter or in a refrigerator in
 *   a sealed bag of damp sand. Seed that needs light is surface-sown and left uncovered; other seed gets a thin
 *   (about 3 mm) layer of coarse sand, which keeps it moist and in place.
 * - Dates, for the coming season (the next last spring frost on or after today):
 *   cold-period seed is sown outdoors from 14 days after the first fall frost (late fall, so it does not sprout
 *   before winter) until 15 January (early winter) or until N days before the last spring frost, whichever is
 *   earlier, so winter gives it at least its N days; sown later, it starts in the refrigerator N days before the
 *   last spring frost (today, if that has passed) and is sown when its N days are over.
 *   Seed needing no cold period is sown in early spring, from 14 days before to 14 days after the last frost,
 *   set in part shade out of hot afternoon sun and kept watered.
 *   Pot up when roots fill the pot, about 6 weeks after germination. Divide clumps and plant out in late summer
 *   to early fall: 8 weeks before the first fall frost, and never later than 6 weeks (42 days) before it, so
 *   roots establish before frost heave.
 * - Frost dates are the yard's; without them, rough defaults for its hardiness zone (marked rough); winters in
 *   zone 9 and warmer are too mild to give a cold period outdoors, so such seed goes in the refrigerator.
 * - Potting mix: a 10 cm square pot filled to 1 cm below the rim holds about 10 × 10 × 8 cm = 0.8 L;
 *   the sand cover takes about 0.03 L a pot (10 × 10 cm × 3 mm); a refrigerator bag about 0.25 L of damp sand.
 */
import { plantsNeeded as plantsForArea } from './plant-count'
import { ringArea, type Point } from './polygon'
import type { SpeciesDetails } from '../types/species'
import { nameKey } from './species-name'

export const POT_SIZE_CM = 10
export const DEFAULT_SEEDLINGS_PER_POT = 10
export const SEEDLINGS_PER_POT_RANGE = [10, 15] as const
export const DEFAULT_MARGIN = 0.2
/** grams in one international avoirdupois pound (exact since 1959; NIST Handbook 44) */
export const GRAMS_PER_POUND = 453.59237
export const COLD_MOIST_TEMPERATURE_C = [1, 5] as const
export const POTTING_MIX_LITRES_PER_POT = 0.8
export const COVER_SAND_LITRES_PER_POT = 0.03
export const FRIDGE_SAND_LITRES_PER_SPECIES = 0.25
export const SAND_COVER_MM = 3
export const PLANT_OUT_MIN_DAYS_BEFORE_FROST = 42
export const PLANT_OUT_DAYS_BEFORE_FROST = 56
export const POT_UP_DAYS_AFTER_GERMINATION = 42
export const COLD_SOW_DAYS_AFTER_FIRST_FROST = 14
/** early winter ends here for sowing outdoors (MM-DD of the spring's year) */
export const COLD_SOW_LATEST = '01-15'
export const SPRING_SOW_DAYS_AROUND_LAST_FROST = 14
/** US dry quart in litres (potting mix is sold by the dry quart in the US): 67.200 625 in³ × 16.387 064 cm³ */
export const LITRES_PER_DRY_QUART = 1.101220942715

/** Seed-size classes by seeds per pound, largest count first, with the seeds to sow in one pot. */
export const SEED_SIZE_CLASSES = [
  { name: 'dust-fine', minSeedsPerPound: 1_000_000, seedsPerPot: 60 },
  { name: 'small', minSeedsPerPound: 200_000, seedsPerPot: 40 },
  { name: 'medium', minSeedsPerPound: 20_000, seedsPerPot: 25 },
  { name: 'large', minSeedsPerPound: 2_000, seedsPerPot: 12 },
  { name: 'very large', minSeedsPerPound: 0, seedsPerPot: 2 },
] as const
export const UNKNOWN_SIZE_SEEDS_PER_POT = 30
export const VERY_LARGE_SEED_PER_POUND = 2_000

/**
 * Rough frost dates by whole hardiness zone (MM-DD), from memory of typical US extension-service tables; always
 * marked rough: a yard's own dates replace them.
 */
export const ZONE_FROST_DEFAULTS: Record<number, { lastSpring: string; firstFall: string }> = {
  1: { lastSpring: '06-10', firstFall: '08-25' },
  2: { lastSpring: '06-01', firstFall: '09-05' },
  3: { lastSpring: '05-25', firstFall: '09-15' },
  4: { lastSpring: '05-15', firstFall: '09-25' },
  5: { lastSpring: '05-05', firstFall: '10-05' },
  6: { lastSpring: '04-25', firstFall: '10-15' },
  7: { lastSpring: '04-10', firstFall: '10-30' },
  8: { lastSpring: '03-25', firstFall: '11-10' },
  9: { lastSpring: '02-25', firstFall: '11-30' },
  10: { lastSpring: '01-30', firstFall: '12-15' },
  11: { lastSpring: '01-15', firstFall: '12-31' },
  12: { lastSpring: '01-15', firstFall: '12-31' },
  13: { lastSpring: '01-15', firstFall: '12-31' },
}
/** the zone assumed when a yard has neither frost dates nor a zone */
export const FALLBACK_ZONE = 6
/** winters colder than this zone give seed its cold period outdoors */
export const WARMEST_ZONE_FOR_OUTDOOR_COLD = 8

// ---------------------------------------------------------------------------------------------------------------
// Inputs and outputs

/** The species facts the seed plan reads: a subset of the catalogue's SpeciesDetails. */
export type SeedFacts = Pick<SpeciesDetails, 'scientificName' | 'commonName' | 'layer' | 'spacing' | 'propagatedBySeed'
  | 'coldStratification' | 'coldMoistDays' | 'seedNeedsLight' | 'scarify' | 'hotWaterSoak' | 'seedsPerPound'
  | 'seedlingsPerPot'> & Partial<Pick<SpeciesDetails, 'toxic' | 'sources'>>

export interface SpeciesSetting { grow?: boolean; seedlingsPerPot?: number | null }
export interface SeedPlanSettings { margin: number; species: Record<string, SpeciesSetting> }

export interface FrostDates {
  lastSpring: string
  firstFall: string
  /** true when the dates are the zone's (or the fallback's) defaults, not the yard's own */
  rough: boolean
  source: 'yard' | 'zone' | 'fallback'
  /** false in mild-winter zones: the cold period needs a refrigerator */
  outdoorCold: boolean
  zone: string | null
}

export type TaskKind = 'prepare' | 'sow-cold' | 'protect' | 'check-moisture' | 'fridge-start' | 'fridge-sow' | 'sow-spring'
  | 'germination' | 'pot-up' | 'plant-out'

export interface SeedTask {
  /** stable within a season: kind and date */
  id: string
  kind: TaskKind
  date: string
  endDate: string | null
  title: string
  detail: string
  species: string[]
  /** an alternative route (the refrigerator while sowing outdoors is still possible) */
  optional: boolean
}

export interface SpeciesPlan {
  key: string
  scientificName: string
  commonName: string | null
  grow: boolean
  defaultGrow: boolean
  plantsNeeded: number
  cultivarsInPlan: boolean
  seedlingsPerPot: number
  seedlingsPerPotSource: 'plan' | 'catalogue' | 'very large seed' | 'default'
  pots: number
  seedsPerPot: number
  seedsPerPotGuessed: boolean
  seeds: number
  seedsPerPound: number | null
  grams: number | null
  coldMoistDays: number
  coldNeedKnown: boolean
  scarify: boolean
  hotWaterSoak: boolean
  surfaceSow: boolean
  /** outdoor sowing window (null: winter here is too mild, use the refrigerator) */
  sowFrom: string | null
  sowTo: string | null
  fridgeStart: string | null
  fridgeSow: string | null
  potUp: string
  plantOut: string
  plantOutBy: string
  treatment: string[]
  /** one line for a pot tag */
  tagTreatment: string
  pricePerGram: number | null
  cost: number | null
  notes: string[]
  sources: Record<string, string>
}

export interface SeedPlan {
  season: { year: number; lastSpringFrost: string; firstFallFrost: string; previousFirstFallFrost: string }
  frost: FrostDates
  margin: number
  species: SpeciesPlan[]
  tasks: SeedTask[]
  totals: {
    species: number
    pots: number
    seeds: number
    grams: number
    gramsUnknown: number
    pottingMixLitres: number
    pottingMixDryQuarts: number
    sandLitres: number
    fridgeSandLitres: number
    cost: number | null
    unpricedSpecies: number
  }
}

// ---------------------------------------------------------------------------------------------------------------
// Dates: plain calendar days in UTC, written YYYY-MM-DD

const DAY_MS = 86_400_000

export function dayOf(year: number, monthDay: string): Date {
  const [m, d] = monthDay.split('-').map(Number)
  return new Date(Date.UTC(year, m! - 1, d!))
}
export function addDays(date: Date, days: number): Date {
  return new Date(date.getTime() + days * DAY_MS)
}
export function isoDate(date: Date): string {
  return date.toISOString().slice(0, 10)
}
export function parseIsoDate(s: string): Date {
  return new Date(`${s}T00:00:00Z`)
}
export function daysBetween(from: string | Date, to: string | Date): number {
  const a = typeof from === 'string' ? parseIsoDate(from) : from
  const b = typeof to === 'string' ? parseIsoDate(to) : to
  return Math.round((b.getTime() - a.getTime()) / DAY_MS)
}
const minDate = (a: Date, b: Date) => (a.getTime() <= b.getTime() ? a : b)
const maxDate = (a: Date, b: Date) => (a.getTime() >= b.getTime() ? a : b)

function zoneNumber(zone: string | null | undefined): number | null {
  const m = /^(\d{1,2})[ab]?$/.exec(zone ?? '')
  return m ? Number(m[1]) : null
}

/** The yard's frost dates, or rough ones for its zone (or for zone 6 when it has neither). */
export function frostDates(yard: { lastSpringFrost?: string | null; firstFallFrost?: string | null; zone?: string | null }): FrostDates {
  const zone = zoneNumber(yard.zone)
  const outdoorCold = zone === null || zone <= WARMEST_ZONE_FOR_OUTDOOR_COLD
  const defaults = ZONE_FROST_DEFAULTS[zone ?? FALLBACK_ZONE] ?? ZONE_FROST_DEFAULTS[FALLBACK_ZONE]!
  if (yard.lastSpringFrost && yard.firstFallFrost) {
    return { lastSpring: yard.lastSpringFrost, firstFall: yard.firstFallFrost, rough: false, source: 'yard', outdoorCold, zone: yard.zone ?? null }
  }
  return {
    lastSpring: yard.lastSpringFrost ?? defaults.lastSpring,
    firstFall: yard.firstFallFrost ?? defaults.firstFall,
    rough: true,
    source: zone === null ? 'fallback' : 'zone',
    outdoorCold,
    zone: yard.zone ?? null,
  }
}

/** The spring of the coming season: the year of the next last spring frost on or after today. */
export function seasonYear(today: string, lastSpring: string): number {
  const t = parseIsoDate(today)
  const year = t.getUTCFullYear()
  return dayOf(year, lastSpring).getTime() >= t.getTime() ? year : year + 1
}

// ---------------------------------------------------------------------------------------------------------------
// Counts

export interface PlanPlanting {
  species: string | null
  cultivar?: string | null
  count?: number
  points?: Point[]
  spacing?: number | null
}

/** Plants per species key (lower-case name) from a plan's plantings; `spacingOf` gives a species' default. */
export function plantsBySpecies(plantings: PlanPlanting[], spacingOf: (key: string) => number | null): Map<string, { name: string; plants: number; cultivars: boolean }> {
  const out = new Map<string, { name: string; plants: number; cultivars: boolean }>()
  for (const p of plantings) {
    if (!p.species) continue
    const key = nameKey(p.species)
    let plants: number
    if (p.points) {
      // spacing null means sown or sodded: no plants to raise in pots
      const spacing = p.spacing === undefined ? spacingOf(key) : p.spacing
      plants = spacing ? plantsForArea(ringArea(p.points), spacing) : 0
    } else {
      plants = p.count ?? 1
    }
    const entry = out.get(key) ?? { name: p.species.trim(), plants: 0, cultivars: false }
    entry.plants += plants
    if (p.cultivar) entry.cultivars = true
    out.set(key, entry)
  }
  return out
}


/** pots = ceil(plants × (1 + margin) ÷ seedlings per pot), ignoring floating-point dust above a whole number */
export function potsNeeded(plants: number, seedlingsPerPot: number, margin = DEFAULT_MARGIN): number {
  if (!(plants > 0) || !(seedlingsPerPot > 0)) return 0
  return Math.ceil((plants * (1 + margin)) / seedlingsPerPot - 1e-9)
}

export function seedsPerPotFor(seedsPerPound: number | null): { seedsPerPot: number; guessed: boolean } {
  if (seedsPerPound === null || !(seedsPerPound > 0)) return { seedsPerPot: UNKNOWN_SIZE_SEEDS_PER_POT, guessed: true }
  const cls = SEED_SIZE_CLASSES.find((c) => seedsPerPound >= c.minSeedsPerPound)!
  return { seedsPerPot: cls.seedsPerPot, guessed: false }
}

/** Grams of `seeds` seeds from USDA's seeds per pound. */
export function gramsForSeeds(seeds: number, seedsPerPound: number | null): number | null {
  if (seedsPerPound === null || !(seedsPerPound > 0)) return null
  return (seeds * GRAMS_PER_POUND) / seedsPerPound
}

export function seedlingsPerPotFor(facts: Pick<SeedFacts, 'seedlingsPerPot' | 'seedsPerPound'>, override?: number | null): { value: number; source: SpeciesPlan['seedlingsPerPotSource'] } {
  if (override && override > 0) return { value: override, source: 'plan' }
  if (facts.seedlingsPerPot && facts.seedlingsPerPot > 0) return { value: facts.seedlingsPerPot, source: 'catalogue' }
  if (facts.seedsPerPound !== null && facts.seedsPerPound > 0 && facts.seedsPerPound < VERY_LARGE_SEED_PER_POUND) return { value: 1, source: 'very large seed' }
  return { value: DEFAULT_SEEDLINGS_PER_POT, source: 'default' }
}

/** Default for the grow toggle: species propagated by seed; when that is not recorded, those with a known seed size. */
export function growsFromSeedByDefault(facts: Pick<SeedFacts, 'propagatedBySeed' | 'seedsPerPound'>): boolean {
  return facts.propagatedBySeed ?? (facts.seedsPerPound !== null)
}

// ---------------------------------------------------------------------------------------------------------------
// Treatment in words and numbers

const fmtDays = (n: number) => `${n} day${n === 1 ? '' : 's'}`

export function treatmentSteps(f: { coldMoistDays: number; coldNeedKnown: boolean; scarify: boolean; hotWaterSoak: boolean; surfaceSow: boolean }): string[] {
  const steps: string[] = []
  if (f.scarify) steps.push('Scarify: rub the seed between two sheets of medium sandpaper until the hard coat looks dull, so water can get in.')
  if (f.hotWaterSoak) steps.push('Hot-water soak: pour water just off the boil (about 80–90 °C, 175–195 °F) over the seed, let it cool and soak for 12–24 hours, and sow the seeds that have swollen.')
  if (f.coldMoistDays > 0) {
    steps.push(`Cold-moist period: ${fmtDays(f.coldMoistDays)} at about 1–5 °C (34–41 °F). Sow outdoors in late fall to early winter and let winter give it, or mix the seed with a little damp sand in a sealed, labelled bag in a refrigerator for ${fmtDays(f.coldMoistDays)}, then sow.`)
  } else if (f.coldNeedKnown) {
    steps.push('No cold period needed: sow in early spring, set the pots in part shade out of hot afternoon sun, and keep them watered.')
  } else {
    steps.push('Whether this seed needs a cold period is not recorded: check with your seed source. Planned as seed that needs none: sown in early spring, in part shade, kept watered.')
  }
  steps.push(f.surfaceSow
    ? 'Sow on the surface and leave it uncovered: this seed needs light to germinate. Press it gently onto the mix.'
    : `Cover with a thin layer (about ${SAND_COVER_MM} mm, 1/8 inch) of coarse sand, which keeps the seed moist and in place.`)
  return steps
}

export function tagTreatment(f: { coldMoistDays: number; scarify: boolean; hotWaterSoak: boolean; surfaceSow: boolean }): string {
  const parts: string[] = []
  if (f.scarify) parts.push('scarified')
  if (f.hotWaterSoak) parts.push('hot-water soak')
  parts.push(f.coldMoistDays > 0 ? `${f.coldMoistDays} days cold-moist, 1–5 °C` : 'no cold period')
  parts.push(f.surfaceSow ? 'surface-sown, uncovered' : 'under 3 mm coarse sand')
  return parts.join('; ')
}

// ---------------------------------------------------------------------------------------------------------------
// The plan

export interface SeedPlanInput {
  today: string
  frost: FrostDates
  settings: SeedPlanSettings
  /** natives in the plan with their plant counts */
  species: Array<{ key: string; name: string; plants: number; cultivars: boolean; facts: SeedFacts | null }>
  /** price per gram by species key, where the coordinator set one */
  prices?: Map<string, number>
}

export function computeSeedPlan(input: SeedPlanInput): SeedPlan {
  const { frost, settings } = input
  const margin = settings.margin
  const year = seasonYear(input.today, frost.lastSpring)
  const today = parseIsoDate(input.today)
  const lastSpring = dayOf(year, frost.lastSpring)
  const firstFall = dayOf(year, frost.firstFall)
  const previousFall = dayOf(year - 1, frost.firstFall)

  const species: SpeciesPlan[] = input.species.map((s) => {
    const f: SeedFacts = s.facts ?? {
      scientificName: s.name, commonName: null, layer: 'ground', spacing: null, propagatedBySeed: null, coldStratification: null,
      coldMoistDays: null, seedNeedsLight: null, scarify: false, hotWaterSoak: false, seedsPerPound: null, seedlingsPerPot: null,
    }
    const setting = settings.species[s.key] ?? {}
    const notes: string[] = []
    const defaultGrow = growsFromSeedByDefault(f)
    const grow = setting.grow ?? defaultGrow
    const seedlings = seedlingsPerPotFor(f, setting.seedlingsPerPot)
    const pots = potsNeeded(s.plants, seedlings.value, margin)
    const perPot = seedsPerPotFor(f.seedsPerPound)
    const seeds = pots * perPot.seedsPerPot
    const grams = gramsForSeeds(seeds, f.seedsPerPound)
    const coldNeedKnown = f.coldStratification !== null || (f.coldMoistDays !== null && f.coldMoistDays > 0)
    const coldMoistDays = f.coldStratification === false ? 0 : Math.max(0, Math.round(f.coldMoistDays ?? (f.coldStratification ? 60 : 0)))
    if (f.coldStratification && f.coldMoistDays === null) notes.push('Cold period length not recorded: 60 days assumed.')
    const surfaceSow = f.seedNeedsLight === true

    let sowFrom: Date | null = null
    let sowTo: Date | null = null
    let fridgeStart: Date | null = null
    let fridgeSow: Date | null = null
    let germination: Date
    if (coldMoistDays > 0) {
      const latestForCold = addDays(lastSpring, -coldMoistDays)
      if (frost.outdoorCold) {
        sowFrom = addDays(previousFall, COLD_SOW_DAYS_AFTER_FIRST_FROST)
        sowTo = minDate(dayOf(year, COLD_SOW_LATEST), latestForCold)
        if (sowTo.getTime() < sowFrom.getTime()) {
          // a cold period longer than the frost-free gap: sow as soon as it fits, which may be before the first frost
          sowFrom = sowTo = latestForCold
          notes.push(`A long cold period: sow outdoors by ${isoDate(latestForCold)} at the latest; some seed of this kind waits a second winter.`)
        }
      } else {
        notes.push('Winters here are too mild for a cold period outdoors: use the refrigerator.')
      }
      fridgeStart = latestForCold
      fridgeSow = lastSpring
      if (fridgeStart.getTime() < today.getTime()) {
        fridgeStart = today
        fridgeSow = addDays(today, coldMoistDays)
      }
      germination = fridgeSow && (!sowTo || sowTo.getTime() < today.getTime()) ? fridgeSow : lastSpring
    } else {
      sowFrom = addDays(lastSpring, -SPRING_SOW_DAYS_AROUND_LAST_FROST)
      sowTo = addDays(lastSpring, SPRING_SOW_DAYS_AROUND_LAST_FROST)
      germination = addDays(sowTo, 7)
    }
    const potUp = addDays(germination, POT_UP_DAYS_AFTER_GERMINATION)
    const plantOutBy = addDays(firstFall, -PLANT_OUT_MIN_DAYS_BEFORE_FROST)
    const plantOut = addDays(firstFall, -PLANT_OUT_DAYS_BEFORE_FROST)
    if (daysBetween(potUp, plantOut) < 21) notes.push('A short season: if the plants are small at plant-out time, keep them in their pots in a sheltered spot over winter and plant out next spring.')
    if (s.cultivars) notes.push('Cultivars do not come true from seed: seedlings will be the straight species.')
    if (f.toxic) notes.push('Toxic if eaten: label the pots and keep seed and seedlings away from children and pets.')
    if (perPot.guessed) notes.push(`Seed size not recorded: ${UNKNOWN_SIZE_SEEDS_PER_POT} seeds a pot assumed.`)
    if (!s.facts) notes.push('Not in the catalogue: treatment unknown, check with your seed source.')

    const price = input.prices?.get(s.key) ?? null
    const steps = treatmentSteps({ coldMoistDays, coldNeedKnown, scarify: f.scarify, hotWaterSoak: f.hotWaterSoak, surfaceSow })
    return {
      key: s.key,
      scientificName: f.scientificName || s.name,
      commonName: f.commonName,
      grow,
      defaultGrow,
      plantsNeeded: s.plants,
      cultivarsInPlan: s.cultivars,
      seedlingsPerPot: seedlings.value,
      seedlingsPerPotSource: seedlings.source,
      pots,
      seedsPerPot: perPot.seedsPerPot,
      seedsPerPotGuessed: perPot.guessed,
      seeds,
      seedsPerPound: f.seedsPerPound,
      grams: grams === null ? null : Math.round(grams * 1000) / 1000,
      coldMoistDays,
      coldNeedKnown,
      scarify: f.scarify,
      hotWaterSoak: f.hotWaterSoak,
      surfaceSow,
      sowFrom: sowFrom && isoDate(sowFrom),
      sowTo: sowTo && isoDate(sowTo),
      fridgeStart: fridgeStart && isoDate(fridgeStart),
      fridgeSow: fridgeSow && isoDate(fridgeSow),
      potUp: isoDate(potUp),
      plantOut: isoDate(plantOut),
      plantOutBy: isoDate(plantOutBy),
      treatment: steps,
      tagTreatment: tagTreatment({ coldMoistDays, scarify: f.scarify, hotWaterSoak: f.hotWaterSoak, surfaceSow }),
      pricePerGram: price,
      cost: price !== null && grams !== null ? Math.round(price * grams * 100) / 100 : null,
      notes,
      sources: f.sources ?? {},
    }
  }).sort((a, b) => a.scientificName.localeCompare(b.scientificName))

  const grown = species.filter((s) => s.grow && s.pots > 0)
  const tasks = buildTasks(grown, { today, lastSpring, firstFall })
  const pots = grown.reduce((n, s) => n + s.pots, 0)
  const coveredPots = grown.filter((s) => !s.surfaceSow).reduce((n, s) => n + s.pots, 0)
  const priced = grown.filter((s) => s.cost !== null)
  const round = (x: number, d = 2) => Math.round(x * 10 ** d) / 10 ** d
  return {
    season: { year, lastSpringFrost: isoDate(lastSpring), firstFallFrost: isoDate(firstFall), previousFirstFallFrost: isoDate(previousFall) },
    frost,
    margin,
    species,
    tasks,
    totals: {
      species: grown.length,
      pots,
      seeds: grown.reduce((n, s) => n + s.seeds, 0),
      grams: round(grown.reduce((n, s) => n + (s.grams ?? 0), 0), 3),
      gramsUnknown: grown.filter((s) => s.grams === null).length,
      pottingMixLitres: round(pots * POTTING_MIX_LITRES_PER_POT, 1),
      pottingMixDryQuarts: round((pots * POTTING_MIX_LITRES_PER_POT) / LITRES_PER_DRY_QUART, 1),
      sandLitres: round(coveredPots * COVER_SAND_LITRES_PER_POT, 2),
      fridgeSandLitres: round(grown.filter((s) => s.coldMoistDays > 0).length * FRIDGE_SAND_LITRES_PER_SPECIES, 2),
      cost: priced.length ? round(priced.reduce((n, s) => n + s.cost!, 0)) : null,
      unpricedSpecies: grown.length - priced.length,
    },
  }
}

function names(list: SpeciesPlan[]): string {
  const n = list.map((s) => s.commonName ? `${s.scientificName} (${s.commonName})` : s.scientificName)
  return n.length <= 2 ? n.join(' and ') : `${n.slice(0, -1).join(', ')} and ${n.at(-1)}`
}

function groupBy<T>(list: T[], key: (t: T) => string): Map<string, T[]> {
  const out = new Map<string, T[]>()
  for (const item of list) {
    const k = key(item)
    out.set(k, [...(out.get(k) ?? []), item])
  }
  return out
}

/** The season's tasks, one per kind and date, naming the species each concerns; in date order. */
export function buildTasks(grown: SpeciesPlan[], d: { today: Date; lastSpring: Date; firstFall: Date }): SeedTask[] {
  const tasks: SeedTask[] = []
  const add = (kind: TaskKind, date: string, endDate: string | null, title: string, detail: string, species: SpeciesPlan[], optional = false) => {
    tasks.push({ id: `${kind}:${date}`, kind, date, endDate, title, detail, species: species.map((s) => s.scientificName), optional })
  }
  if (!grown.length) return tasks
  const cold = grown.filter((s) => s.coldMoistDays > 0)
  const outdoorCold = cold.filter((s) => s.sowFrom)
  const spring = grown.filter((s) => s.coldMoistDays === 0)
  const fridge = cold.filter((s) => s.fridgeStart)
  const pots = grown.reduce((n, s) => n + s.pots, 0)

  const firstSow = grown.map((s) => s.sowFrom ?? s.fridgeStart!).sort()[0]!
  add('prepare', isoDate(addDays(parseIsoDate(firstSow), -14)), firstSow, 'Prepare pots and labels',
    `Get ${pots} clean 10 cm (4-inch) pots, about ${Math.round(pots * POTTING_MIX_LITRES_PER_POT * 10) / 10} L of seed-starting or potting mix, coarse sand, and a label for each pot. Write labels in pencil: ink and marker fade outdoors.`, grown)

  for (const [, group] of groupBy(outdoorCold, (s) => `${s.sowFrom}|${s.sowTo}`)) {
    const g = group[0]!
    add('sow-cold', g.sowFrom!, g.sowTo, `Sow outdoors: ${names(group)}`,
      `Sow between ${g.sowFrom} and ${g.sowTo} and leave the pots outdoors: winter gives the seed its cold-moist period (${group.map((s) => `${s.scientificName} ${s.coldMoistDays} days`).join(', ')}) before the last spring frost on ${isoDate(d.lastSpring)}. ${group.map((s) => `${s.scientificName}: ${s.surfaceSow ? 'surface-sown, uncovered' : 'under a thin layer of coarse sand'}`).join('; ')}.`, group)
  }
  if (outdoorCold.length) {
    const firstColdSow = outdoorCold.map((s) => s.sowFrom!).sort()[0]!
    add('protect', firstColdSow, null, 'Protect the pots over winter',
      'Cover the sown pots with hardware cloth (about 6 mm, 1/4-inch mesh) so mice, voles, squirrels and birds cannot dig out the seed; set them where rain and snow reach them, out of drying wind.', outdoorCold)
    // a check each 4 weeks through winter, until the last frost
    for (let day = addDays(parseIsoDate(firstColdSow), 28); day.getTime() < d.lastSpring.getTime(); day = addDays(day, 28)) {
      add('check-moisture', isoDate(day), null, 'Check the pots are moist',
        'Look at the pots on a mild day: the mix should be moist, not frozen dry. Water if it is dry; a pot that dries out loses the cold period.', outdoorCold)
    }
  }
  for (const [, group] of groupBy(fridge, (s) => `${s.fridgeStart}|${s.fridgeSow}`)) {
    const g = group[0]!
    // the refrigerator is an alternative while sowing outdoors is still possible
    const optional = group.every((s) => s.sowTo !== null && parseIsoDate(s.sowTo).getTime() >= d.today.getTime())
    add('fridge-start', g.fridgeStart!, null, `Start seed in the refrigerator: ${names(group)}`,
      `${optional ? 'If not sown outdoors in time: m' : 'M'}ix the seed with a little damp sand in a sealed, labelled bag and keep it in a refrigerator at about 1–5 °C (${group.map((s) => `${s.scientificName} ${s.coldMoistDays} days`).join(', ')}). Check the sand stays damp.`, group, optional)
    add('fridge-sow', g.fridgeSow!, null, `Sow the refrigerated seed: ${names(group)}`,
      'Sow the seed with its sand in the pots, set them outdoors in part shade and keep them watered.', group, optional)
  }
  for (const [, group] of groupBy(spring, (s) => `${s.sowFrom}|${s.sowTo}`)) {
    const g = group[0]!
    add('sow-spring', g.sowFrom!, g.sowTo, `Sow in early spring: ${names(group)}`,
      `No cold period needed. Sow between ${g.sowFrom} and ${g.sowTo}, set the pots in part shade out of hot afternoon sun, and keep them watered. ${group.map((s) => `${s.scientificName}: ${s.surfaceSow ? 'surface-sown, uncovered' : 'under a thin layer of coarse sand'}`).join('; ')}.`, group)
  }
  if (cold.length) {
    add('germination', isoDate(addDays(d.lastSpring, -28)), isoDate(d.lastSpring), 'Watch for germination',
      'As the weather warms, look for seedlings. Take the hardware cloth off once they show, move the pots to part shade and keep them watered.', cold)
  }
  for (const [date, group] of groupBy(grown, (s) => s.potUp)) {
    add('pot-up', date, null, `Pot up: ${names(group)}`,
      'When roots fill the pot (they show at the drainage holes), tip out each pot and move clumps of seedlings into their own pots with fresh mix; water them in.', group)
  }
  for (const [date, group] of groupBy(grown, (s) => s.plantOut)) {
    const by = group[0]!.plantOutBy
    add('plant-out', date, by, `Divide and plant out: ${names(group)}`,
      `Late summer to early fall: divide each pot's clump into plants, set them out at the plan's spacing and water them in, by ${by} at the latest, ${PLANT_OUT_MIN_DAYS_BEFORE_FROST} days (6 weeks) before the first fall frost on ${isoDate(d.firstFall)}, so roots establish before frost heave. Call your utility-locating service before digging large holes.`, group)
  }
  return tasks.sort((a, b) => a.date.localeCompare(b.date) || a.kind.localeCompare(b.kind))
}
