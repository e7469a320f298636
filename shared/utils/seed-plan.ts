/**
 * Grow from seed: the rules that turn a yard plan's native species into pots to sow, seed to buy, treatments and
 * tasks. Dates and routes are in seed-season.ts, seed size (depth, seeds and seedlings a pot) in seed-size.ts; this
 * file puts them together (no I/O). The server route feeds it the plan, the species facts and the settings; the
 * page, the calendar, the pot tags and the reminders all read what it returns.
 *
 * Rules (common practice for sowing natives in pots outdoors, unless a source is named):
 * - Only species native in the yard's region are raised (not "native and introduced", introduced or invasive ones).
 * - Plants needed: point plantings count their plants (1 unless a count is given); drifts count
 *   area ÷ (0.866 × spacing²), the triangular layout (shared/utils/plant-count.ts), rounded up per drift.
 * - Seedlings a pot: the plan's override, else the catalogue's figure, else the seed-size default; seeds a pot =
 *   seedlings ÷ the expected germination share (seed-size.ts), so never fewer seeds than seedlings.
 * - Pots = ceil(plants × (1 + margin) ÷ seedlings per pot); the spare margin is 20 % unless the plan says.
 * - Cold need: a coordinator's cold-moist days win; else USDA PLANTS' "cold stratification required" flag (its days
 *   a catalogue default); no flag → unknown, sown outdoors for winter cold (seed-season.ts).
 * - Pre-treatment: a hard seed coat is scarified (nicked with sandpaper) or soaked in hot water first.
 * - Potting mix: a 10 cm square pot filled to 1 cm below the rim holds about 10 × 10 × 8 cm = 0.8 L;
 *   the sand cover takes about 0.03 L a pot (10 × 10 cm × 3 mm); a refrigerator bag about 0.25 L of damp sand.
 */
import { plantsNeeded as plantsForArea } from './plant-count'
import { ringArea, type Point } from './polygon'
import { USDA, ESTIMATED, defaultColdMoistDays } from './catalogue-rules'
import { gramsForSeeds, seedsPerPotFor, seedlingsPerPotFor as defaultSeedlings, sowingFor, type SowDepth } from './seed-size'
import {
  addDays, isoDate, parseIsoDate, seasonFrame, scheduleSpecies, seasonEnd,
  PLANT_OUT_DAYS_BEFORE_FROST, UNKNOWN_COLD_FRIDGE_DAYS,
  type FrostDates, type ColdNeed, type SowRoute, type Schedule,
} from './seed-season'
import type { RegionStatus, SpeciesDetails } from '../types/species'


export const POT_SIZE_CM = 10
export const DEFAULT_MARGIN = 0.2
export const COLD_MOIST_TEMPERATURE_C = [1, 5] as const
export const POTTING_MIX_LITRES_PER_POT = 0.8
export const COVER_SAND_LITRES_PER_POT = 0.03
export const FRIDGE_SAND_LITRES_PER_SPECIES = 0.25
/** US dry quart in litres (potting mix is sold by the dry quart in the US): 67.200 625 in³ × 16.387 064 cm³ */
export const LITRES_PER_DRY_QUART = 1.101220942715

/** How each sowing route reads on the page and the pot tags. */
export const ROUTE_LABEL: Record<SowRoute, string> = {
  'outdoor-winter': 'Outdoors, late fall to early winter',
  fresh: 'Fresh, in fall as collected',
  spring: 'Early spring',
  fridge: 'Refrigerator, then sow',
  'cool-season': 'Start of the cool season',
}

// ---------------------------------------------------------------------------------------------------------------
// Inputs and outputs

/** The species facts the seed plan reads: a subset of the catalogue's SpeciesDetails. */
export type SeedFacts = Pick<SpeciesDetails, 'scientificName' | 'commonName' | 'layer' | 'spacing' | 'propagatedBySeed'
  | 'coldStratification' | 'coldMoistDays' | 'seedNeedsLight' | 'scarify' | 'hotWaterSoak' | 'seedsPerPound'
  | 'seedlingsPerPot'> & Partial<Pick<SpeciesDetails, 'toxic' | 'sources' | 'sowFresh'>>

export interface SpeciesSetting { grow?: boolean; seedlingsPerPot?: number | null }
export interface SeedPlanSettings { margin: number; species: Record<string, SpeciesSetting> }

export type TaskKind = 'prepare' | 'sow-fresh' | 'sow-cold' | 'sow-fall' | 'protect' | 'check-moisture' | 'fridge-start' | 'fridge-sow'
  | 'sow-spring' | 'sow-cool' | 'germination' | 'pot-up' | 'plant-out'

export interface SeedTask {
  /** stable within a season: kind and date */
  id: string
  kind: TaskKind
  date: string
  endDate: string | null
  title: string
  detail: string
  species: string[]
  /** an alternative route (the refrigerator while sowing outdoors is still possible, fall sowing of seed needing no cold) */
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
  seedlingsPerPotSource: 'plan' | 'catalogue' | 'default'
  pots: number
  seedsPerPot: number
  seeds: number
  seedsPerPound: number | null
  grams: number | null
  /** days of cold-moist the plan gives (planned, when the need is unknown) */
  coldMoistDays: number
  coldNeed: ColdNeed
  coldNeedSource: 'coordinator' | 'USDA PLANTS' | null
  coldNeedKnown: boolean
  sowFresh: boolean
  route: SowRoute
  scarify: boolean
  hotWaterSoak: boolean
  depth: SowDepth
  surfaceSow: boolean
  /** primary sowing window (null when the refrigerator is the route) */
  sowFrom: string | null
  sowTo: string | null
  /** late-fall option for seed that needs no cold period */
  altSowFrom: string | null
  altSowTo: string | null
  fridgeStart: string | null
  fridgeSow: string | null
  germinationFrom: string
  germination: string
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
  season: {
    year: number
    frostFree: boolean
    /** YYYY-MM-DD; null in a frost-free place */
    lastSpringFrost: string | null
    firstFallFrost: string | null
    previousFirstFallFrost: string | null
    /** the plan's last day: the next season's plan starts the day after */
    ends: string
    note: string | null
  }
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
    const key = speciesKey(p.species)
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

export function speciesKey(name: string): string {
  return name.trim().toLowerCase().replace(/\s+/g, ' ')
}

/** pots = ceil(plants × (1 + margin) ÷ seedlings per pot), ignoring floating-point dust above a whole number */
export function potsNeeded(plants: number, seedlingsPerPot: number, margin = DEFAULT_MARGIN): number {
  if (!(plants > 0) || !(seedlingsPerPot > 0)) return 0
  return Math.ceil((plants * (1 + margin)) / seedlingsPerPot - 1e-9)
}

/** Only species native in the region are raised from seed: the point is to add natives. */
export function raisedFromSeed(status: RegionStatus | null | undefined): boolean {
  return status === 'native'
}

/** Seedlings a pot: the plan's override, then the catalogue's figure, then the seed-size default for its layer. */
export function seedlingsPerPotOf(facts: Pick<SeedFacts, 'seedlingsPerPot' | 'seedsPerPound' | 'layer'>, override?: number | null): { value: number; source: SpeciesPlan['seedlingsPerPotSource'] } {
  if (override && override > 0) return { value: override, source: 'plan' }
  if (facts.seedlingsPerPot && facts.seedlingsPerPot > 0) return { value: facts.seedlingsPerPot, source: 'catalogue' }
  return { value: defaultSeedlings(facts.layer, facts.seedsPerPound), source: 'default' }
}

/** Default for the grow toggle: every native unless USDA PLANTS says it is not propagated by seed. */
export function growsFromSeedByDefault(facts: Pick<SeedFacts, 'propagatedBySeed'>): boolean {
  return facts.propagatedBySeed !== false
}

/** A value a coordinator set: its source is neither USDA PLANTS nor a default. */
function setByCoordinator(source: string | undefined): boolean {
  return !!source && source !== USDA && !source.startsWith(ESTIMATED) && !source.startsWith('from memory')
}

/**
 * Whether the seed needs a cold period, and how many days: a coordinator's cold-moist days win; then USDA PLANTS'
 * flag (its length the catalogue's default when not given); else unknown.
 */
export function coldNeedOf(f: Pick<SeedFacts, 'coldStratification' | 'coldMoistDays' | 'layer'> & { sources?: Record<string, string> }): { need: ColdNeed; days: number; source: SpeciesPlan['coldNeedSource']; assumedDays: boolean } {
  if (f.coldMoistDays !== null && setByCoordinator(f.sources?.coldMoistDays)) {
    const days = Math.max(0, Math.round(f.coldMoistDays))
    return { need: days > 0 ? 'needed' : 'none', days, source: 'coordinator', assumedDays: false }
  }
  if (f.coldStratification === false) return { need: 'none', days: 0, source: USDA, assumedDays: false }
  if (f.coldStratification === true) {
    const given = f.coldMoistDays !== null && f.coldMoistDays > 0
    return { need: 'needed', days: given ? Math.round(f.coldMoistDays!) : defaultColdMoistDays(f.layer, true)!, source: USDA, assumedDays: !f.sources?.coldMoistDays || f.sources.coldMoistDays.startsWith(ESTIMATED) }
  }
  if (f.coldMoistDays !== null && f.coldMoistDays > 0) return { need: 'needed', days: Math.round(f.coldMoistDays), source: 'coordinator', assumedDays: false }
  return { need: 'unknown', days: 0, source: null, assumedDays: false }
}

// ---------------------------------------------------------------------------------------------------------------
// Treatment in words and numbers

const fmtDays = (n: number) => `${n} day${n === 1 ? '' : 's'}`

interface TreatmentFacts { coldNeed: ColdNeed; coldMoistDays: number; route: SowRoute; sowFresh: boolean; scarify: boolean; hotWaterSoak: boolean; sowing: { words: string; tag: string }; frostFree: boolean }

export function treatmentSteps(f: TreatmentFacts): string[] {
  const steps: string[] = []
  if (f.sowFresh) steps.push('Sow fresh: this seed dies if it dries out. Sow it in fall as soon as it is collected (drop it in water first and discard any that float); never store it dry until spring.')
  if (f.scarify) steps.push('Scarify: rub the seed between two sheets of medium sandpaper until the hard coat looks dull, so water can get in.')
  if (f.hotWaterSoak) steps.push('Hot-water soak: pour water just off the boil (about 80–90 °C, 175–195 °F) over the seed, let it cool and soak for 12–24 hours, and sow the seeds that have swollen.')
  const fridge = (days: number) => `mix the seed with a little damp sand in a sealed, labelled bag in a refrigerator at about 1–5 °C (34–41 °F) for ${fmtDays(days)}, then sow`
  if (f.coldNeed === 'needed') {
    steps.push(f.route === 'fridge' || f.frostFree
      ? `Cold-moist period: ${fmtDays(f.coldMoistDays)} at about 1–5 °C (34–41 °F). Winters here are too mild to give it outdoors: ${fridge(f.coldMoistDays)}.`
      : `Cold-moist period: ${fmtDays(f.coldMoistDays)} at about 1–5 °C (34–41 °F). Sow outdoors in late fall to early winter and let winter give it, or ${fridge(f.coldMoistDays)}.`)
  } else if (f.coldNeed === 'unknown') {
    steps.push(f.route === 'fridge' || f.frostFree
      ? `Whether this seed needs a cold period is not recorded (USDA PLANTS has no answer for it). Most natives of cold-winter places do, and winters here are too mild to give it, so ${fridge(UNKNOWN_COLD_FRIDGE_DAYS)}: a short cold period does no harm to seed that needs none.`
      : 'Whether this seed needs a cold period is not recorded (USDA PLANTS has no answer for it). Most natives do, so sow it outdoors from late fall to early winter: winter then gives it a cold-moist period if it needs one and does it no harm if it does not. Seed sown in spring instead may not come up until the next year.')
  } else if (f.frostFree) {
    steps.push('No cold period needed: sow at the start of the cool season, set the pots in part shade and keep them watered.')
  } else if (!f.sowFresh) {
    steps.push('No cold period needed: sow in late fall, or in early spring with the pots set in part shade out of hot afternoon sun and kept watered.')
  }
  steps.push(f.sowing.words)
  return steps
}

/** The treatment a species' seed needs from its catalogue facts alone, where no yard's frost dates apply (a sale's packets). */
export function treatmentFacts(f: SeedFacts & { sources?: Record<string, string> }): TreatmentFacts {
  const cold = coldNeedOf(f)
  const sowFresh = f.sowFresh === true
  const route: SowRoute = sowFresh ? 'fresh' : cold.need === 'none' ? 'spring' : 'outdoor-winter'
  return { coldNeed: cold.need, coldMoistDays: cold.days, route, sowFresh, scarify: f.scarify === true, hotWaterSoak: f.hotWaterSoak === true, sowing: sowingFor(f.seedsPerPound, f.seedNeedsLight), frostFree: false }
}

export function tagTreatment(f: Pick<TreatmentFacts, 'coldNeed' | 'coldMoistDays' | 'scarify' | 'hotWaterSoak' | 'sowFresh' | 'sowing'>): string {
  const parts: string[] = []
  if (f.sowFresh) parts.push('sown fresh')
  if (f.scarify) parts.push('scarified')
  if (f.hotWaterSoak) parts.push('hot-water soak')
  parts.push(f.coldNeed === 'needed' ? `${f.coldMoistDays} days cold-moist, 1–5 °C` : f.coldNeed === 'unknown' ? 'cold need unknown: winter cold given' : 'no cold period')
  parts.push(f.sowing.tag)
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

const NO_FACTS = (name: string): SeedFacts => ({
  scientificName: name, commonName: null, layer: 'ground', spacing: null, propagatedBySeed: null, coldStratification: null,
  coldMoistDays: null, seedNeedsLight: null, scarify: false, hotWaterSoak: false, seedsPerPound: null, seedlingsPerPot: null,
})

/** The plan for the season `today` falls in (see seed-season.ts): the first whose end is on or after today. */
export function computeSeedPlan(input: SeedPlanInput): SeedPlan {
  const today = parseIsoDate(input.today)
  for (let year = today.getUTCFullYear() - 1; ; year++) {
    const plan = planForSeason(input, year)
    if (plan.season.ends >= input.today || year > today.getUTCFullYear() + 1) return plan
  }
}

/** The plan of the season whose spring is in `year`. */
export function planForSeason(input: SeedPlanInput, year: number): SeedPlan {
  const { frost, settings } = input
  const margin = settings.margin
  const today = parseIsoDate(input.today)
  const frame = seasonFrame(year, frost)

  const species: SpeciesPlan[] = input.species.map((s) => {
    const f: SeedFacts = s.facts ?? NO_FACTS(s.name)
    const setting = settings.species[s.key] ?? {}
    const notes: string[] = []
    const defaultGrow = growsFromSeedByDefault(f)
    const seedlings = seedlingsPerPotOf(f, setting.seedlingsPerPot)
    const pots = potsNeeded(s.plants, seedlings.value, margin)
    const seedsPerPot = seedsPerPotFor(seedlings.value)
    const seeds = pots * seedsPerPot
    const grams = gramsForSeeds(seeds, f.seedsPerPound)
    const cold = coldNeedOf(f)
    const sowFresh = f.sowFresh === true
    const sch: Schedule = scheduleSpecies({ coldNeed: cold.need, coldDays: cold.days, fresh: sowFresh }, frame, today)
    const sowing = sowingFor(f.seedsPerPound, f.seedNeedsLight)
    if (cold.assumedDays) notes.push(`Cold period length not recorded: ${cold.days} days assumed.`)
    notes.push(...sch.notes)
    if (sch.lateForPlantOut) notes.push(frame.frostFree
      ? 'Too late to plant out this cool season: keep the pots in part shade and watered, and plant out at the start of the next rains.'
      : 'A short season: if the plants are not ready to plant out by two weeks before the first fall frost, keep them in their pots in a sheltered spot over winter and plant out next spring.')
    if (s.cultivars) notes.push('Cultivars do not come true from seed: seedlings will be the straight species.')
    if (f.toxic) notes.push('Toxic if eaten: label the pots and keep seed and seedlings away from children and pets.')
    if (sowing.size === 'unknown') notes.push('Seed size not recorded: planned with a thin sand cover; weigh a few seeds or ask your seed source.')
    if (!s.facts) notes.push('Not in the catalogue: treatment unknown, check with your seed source.')

    const price = input.prices?.get(s.key) ?? null
    const treat = { coldNeed: cold.need, coldMoistDays: sch.coldDays, route: sch.route, sowFresh, scarify: f.scarify, hotWaterSoak: f.hotWaterSoak, sowing, frostFree: frame.frostFree }
    const iso = (d: Date | null) => d && isoDate(d)
    return {
      key: s.key,
      scientificName: f.scientificName || s.name,
      commonName: f.commonName,
      grow: setting.grow ?? defaultGrow,
      defaultGrow,
      plantsNeeded: s.plants,
      cultivarsInPlan: s.cultivars,
      seedlingsPerPot: seedlings.value,
      seedlingsPerPotSource: seedlings.source,
      pots,
      seedsPerPot,
      seeds,
      seedsPerPound: f.seedsPerPound,
      grams: grams === null ? null : Math.round(grams * 1000) / 1000,
      coldMoistDays: sch.coldDays,
      coldNeed: cold.need,
      coldNeedSource: cold.source,
      coldNeedKnown: cold.need !== 'unknown',
      sowFresh,
      route: sch.route,
      scarify: f.scarify,
      hotWaterSoak: f.hotWaterSoak,
      depth: sowing.depth,
      surfaceSow: sowing.depth === 'surface',
      sowFrom: iso(sch.sowFrom),
      sowTo: iso(sch.sowTo),
      altSowFrom: iso(sch.altSowFrom),
      altSowTo: iso(sch.altSowTo),
      fridgeStart: iso(sch.fridgeStart),
      fridgeSow: iso(sch.fridgeSow),
      germinationFrom: isoDate(sch.germinationFrom),
      germination: isoDate(sch.germination),
      potUp: isoDate(sch.potUp),
      plantOut: isoDate(sch.plantOut),
      plantOutBy: isoDate(sch.plantOutBy),
      treatment: treatmentSteps(treat),
      tagTreatment: tagTreatment(treat),
      pricePerGram: price,
      cost: price !== null && grams !== null ? Math.round(price * grams * 100) / 100 : null,
      notes,
      sources: f.sources ?? {},
    }
  }).sort((a, b) => a.scientificName.localeCompare(b.scientificName))

  const grown = species.filter((s) => s.grow && s.pots > 0)
  const tasks = buildTasks(grown, { today, frame })
  const ends = seasonEnd(frame, frost, grown.map((s) => parseIsoDate(s.plantOut)))
  const pots = grown.reduce((n, s) => n + s.pots, 0)
  const coveredPots = grown.filter((s) => !s.surfaceSow).reduce((n, s) => n + s.pots, 0)
  const priced = grown.filter((s) => s.cost !== null)
  const round = (x: number, d = 2) => Math.round(x * 10 ** d) / 10 ** d
  const iso = (d: Date | null) => d && isoDate(d)
  return {
    season: {
      year,
      frostFree: frame.frostFree,
      lastSpringFrost: iso(frame.lastSpring),
      firstFallFrost: iso(frame.firstFall),
      previousFirstFallFrost: iso(frame.previousFall),
      ends: isoDate(ends),
      note: frame.frostFree ? 'Frost-free here: the plan follows the cool season, sowing in mid-fall and planting out in winter while cool, moist weather lets roots establish before the dry heat.' : null,
    },
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
      fridgeSandLitres: round(grown.filter((s) => s.fridgeStart).length * FRIDGE_SAND_LITRES_PER_SPECIES, 2),
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

const howSown = (group: SpeciesPlan[]) => group.map((s) => `${s.scientificName}: ${s.tagTreatment}`).join('; ')

/** The season's tasks, one per kind and date, naming the species each concerns; in date order. */
export function buildTasks(grown: SpeciesPlan[], d: { today: Date; frame: ReturnType<typeof seasonFrame> }): SeedTask[] {
  const tasks: SeedTask[] = []
  const add = (kind: TaskKind, date: string, endDate: string | null, title: string, detail: string, species: SpeciesPlan[], optional = false) => {
    tasks.push({ id: `${kind}:${date}`, kind, date, endDate, title, detail, species: species.map((s) => s.scientificName), optional })
  }
  if (!grown.length) return tasks
  const { frame } = d
  const lastFrost = frame.lastSpring && isoDate(frame.lastSpring)
  const pots = grown.reduce((n, s) => n + s.pots, 0)

  const firstSow = grown.flatMap((s) => [s.sowFrom, s.altSowFrom, s.fridgeStart]).filter((x): x is string => !!x).sort()[0]!
  add('prepare', isoDate(addDays(parseIsoDate(firstSow), -14)), firstSow, 'Prepare pots and labels',
    `Get ${pots} clean 10 cm (4-inch) pots (deep ones for acorns and nuts), about ${Math.round(pots * POTTING_MIX_LITRES_PER_POT * 10) / 10} L of seed-starting or potting mix, coarse sand, hardware cloth, and a label for each pot. Write labels in pencil: ink and marker fade outdoors.`, grown)

  const sown = (route: SowRoute) => grown.filter((s) => s.route === route && s.sowFrom)
  for (const [, group] of groupBy(sown('fresh'), (s) => `${s.sowFrom}|${s.sowTo}`)) {
    const g = group[0]!
    add('sow-fresh', g.sowFrom!, g.sowTo, `Sow fresh seed as you collect it: ${names(group)}`,
      `This seed dies if it dries out: sow it between ${g.sowFrom} and ${g.sowTo}, as soon as it falls or is collected, and leave the pots outdoors over winter. Never store it dry until spring. ${howSown(group)}.`, group)
  }
  for (const [, group] of groupBy(sown('outdoor-winter'), (s) => `${s.sowFrom}|${s.sowTo}`)) {
    const g = group[0]!
    const known = group.filter((s) => s.coldNeed === 'needed'), unknown = group.filter((s) => s.coldNeed === 'unknown')
    add('sow-cold', g.sowFrom!, g.sowTo, `Sow outdoors for winter: ${names(group)}`,
      [`Sow between ${g.sowFrom} and ${g.sowTo} and leave the pots outdoors: winter gives the seed its cold-moist period before the last spring frost on ${lastFrost}.`,
        known.length ? `Cold period needed: ${known.map((s) => `${s.scientificName} ${s.coldMoistDays} days`).join(', ')}.` : '',
        unknown.length ? `Cold need not recorded (${unknown.map((s) => s.scientificName).join(', ')}): winter sowing gives a cold period if the seed needs one and does no harm if not.` : '',
        `${howSown(group)}.`].filter(Boolean).join(' '), group)
  }
  for (const [, group] of groupBy(grown.filter((s) => s.altSowFrom), (s) => `${s.altSowFrom}|${s.altSowTo}`)) {
    const g = group[0]!
    add('sow-fall', g.altSowFrom!, g.altSowTo, `Or sow in late fall: ${names(group)}`,
      `No cold period needed: sow between ${g.altSowFrom} and ${g.altSowTo} and leave the pots outdoors over winter, instead of sowing in early spring. ${howSown(group)}.`, group, true)
  }
  const outdoors = grown.filter((s) => (s.route === 'outdoor-winter' || s.route === 'fresh') && s.sowFrom && frame.outdoorCold)
  if (outdoors.length && lastFrost) {
    const firstOut = outdoors.map((s) => s.sowFrom!).sort()[0]!
    add('protect', firstOut, null, 'Protect the pots over winter',
      'Cover the sown pots with hardware cloth (about 6 mm, 1/4-inch mesh) so mice, voles, squirrels and birds cannot dig out the seed; set them where rain and snow reach them, out of drying wind.', outdoors)
    // a check each 4 weeks through winter, until the last frost
    for (let day = addDays(parseIsoDate(firstOut), 28); day.getTime() < frame.lastSpring!.getTime(); day = addDays(day, 28)) {
      add('check-moisture', isoDate(day), null, 'Check the pots are moist',
        'Look at the pots on a mild day: the mix should be moist, not frozen dry. Water if it is dry; a pot that dries out loses the cold period.', outdoors)
    }
  }
  for (const [, group] of groupBy(grown.filter((s) => s.fridgeStart), (s) => `${s.fridgeStart}|${s.fridgeSow}|${s.route === 'outdoor-winter'}`)) {
    const g = group[0]!
    // the refrigerator is an alternative while sowing outdoors is still possible
    const optional = g.route === 'outdoor-winter'
    add('fridge-start', g.fridgeStart!, null, `Start seed in the refrigerator: ${names(group)}`,
      `${optional ? 'If not sown outdoors in time: m' : 'M'}ix the seed with a little damp sand in a sealed, labelled bag and keep it in a refrigerator at about 1–5 °C (${group.map((s) => `${s.scientificName} ${s.coldMoistDays} days`).join(', ')}). Check the sand stays damp.`, group, optional)
    add('fridge-sow', g.fridgeSow!, null, `Sow the refrigerated seed: ${names(group)}`,
      `Sow the seed with its sand in the pots, set them outdoors in part shade and keep them watered. ${howSown(group)}.`, group, optional)
  }
  for (const [, group] of groupBy(sown('spring'), (s) => `${s.sowFrom}|${s.sowTo}`)) {
    const g = group[0]!
    add('sow-spring', g.sowFrom!, g.sowTo, `Sow in early spring: ${names(group)}`,
      `No cold period needed. Sow between ${g.sowFrom} and ${g.sowTo}, set the pots in part shade out of hot afternoon sun, and keep them watered. ${howSown(group)}.`, group)
  }
  for (const [, group] of groupBy(sown('cool-season'), (s) => `${s.sowFrom}|${s.sowTo}`)) {
    const g = group[0]!
    add('sow-cool', g.sowFrom!, g.sowTo, `Sow at the start of the cool season: ${names(group)}`,
      `Frost-free here: sow between ${g.sowFrom} and ${g.sowTo}, set the pots in part shade and keep them watered. ${howSown(group)}.`, group)
  }
  for (const [, group] of groupBy(grown, (s) => `${s.germinationFrom}|${s.germination}`)) {
    const g = group[0]!
    add('germination', g.germinationFrom, g.germination, `Watch for germination: ${names(group)}`,
      'Look for seedlings. Take the hardware cloth off once they show (leave it on large seed until the shoot is up), move the pots to part shade and keep them watered.', group)
  }
  for (const [date, group] of groupBy(grown, (s) => s.potUp)) {
    add('pot-up', date, null, `Pot up: ${names(group)}`,
      'When roots fill the pot (they show at the drainage holes), tip out each pot and move clumps of seedlings into their own pots with fresh mix; water them in.', group)
  }
  for (const [, group] of groupBy(grown, (s) => `${s.plantOut}|${s.plantOutBy}`)) {
    const g = group[0]!
    const when = frame.frostFree
      ? `Plant out in the cool, moist season, by ${g.plantOutBy}, so roots establish before the dry heat.`
      : `Early fall: plant out by ${g.plantOutBy} at the latest, ${PLANT_OUT_DAYS_BEFORE_FROST[1]} days (2 weeks) before the first fall frost on ${isoDate(frame.firstFall!)}, so roots establish before the ground freezes and frost heaves them.`
    add('plant-out', g.plantOut, g.plantOutBy, `Divide and plant out: ${names(group)}`,
      `${when} Divide each pot's clump into plants, set them out at the plan's spacing and water them in. Call your utility-locating service before digging large holes.`, group)
  }
  return tasks.sort((a, b) => a.date.localeCompare(b.date) || a.kind.localeCompare(b.kind))
}
