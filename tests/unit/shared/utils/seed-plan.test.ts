import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import {
  potsNeeded, DEFAULT_MARGIN, computeSeedPlan, plantsBySpecies, raisedFromSeed, coldNeedOf,
  growsFromSeedByDefault, type SeedFacts, type SpeciesPlan, type SeedPlan,
} from '#shared/utils/seed-plan'
import { frostDates, daysBetween, addDays, parseIsoDate, isoDate, type FrostDates } from '#shared/utils/seed-season'
import { REGION_STATUSES } from '#shared/types/species'

const base: SeedFacts = {
  scientificName: 'Echinacea purpurea', commonName: 'purple coneflower', layer: 'ground', spacing: 0.45,
  propagatedBySeed: true, coldStratification: true, coldMoistDays: 60, seedNeedsLight: false, scarify: false,
  hotWaterSoak: false, seedsPerPound: 115_664, seedlingsPerPot: null, sources: { coldStratification: 'USDA PLANTS', coldMoistDays: 'estimated: herbaceous plants needing a cold period' },
}
// USDA PLANTS plant_characteristics: Asclepias tuberosa cold_stratification_required FALSE, 70,000 seeds a pound
const milkweed: Partial<SeedFacts> = { scientificName: 'Asclepias tuberosa', coldStratification: false, coldMoistDays: 0, seedsPerPound: 70_000, sources: { coldMoistDays: 'USDA PLANTS' } }
// USDA PLANTS has no characteristics row for Symphyotrichum novae-angliae: cold need and seed size unknown
const aster: Partial<SeedFacts> = { scientificName: 'Symphyotrichum novae-angliae', propagatedBySeed: null, coldStratification: null, coldMoistDays: null, seedsPerPound: null, sources: {} }
// USDA PLANTS: Quercus alba cold_stratification_required FALSE, 128 seeds a pound; white-oak acorns are sown fresh
// (Agriculture Handbook 727, Quercus: acorns of the white oak group germinate soon after falling)
const whiteOak: Partial<SeedFacts> = { scientificName: 'Quercus alba', layer: 'tree', coldStratification: false, coldMoistDays: 0, seedsPerPound: 128, seedlingsPerPot: 1, sowFresh: true, sources: { coldMoistDays: 'USDA PLANTS' } }

const ohio: FrostDates = { lastSpring: '04-25', firstFall: '10-15', rough: false, source: 'yard', outdoorCold: true, frostFree: false, zone: '6a' }

function plan(facts: Partial<SeedFacts>, opts: { plants?: number; today?: string; frost?: FrostDates; margin?: number; seedlings?: number } = {}) {
  const f = { ...base, ...facts }
  return computeSeedPlan({
    today: opts.today ?? '2026-12-01',
    frost: opts.frost ?? ohio,
    settings: { margin: opts.margin ?? DEFAULT_MARGIN, species: opts.seedlings ? { x: { seedlingsPerPot: opts.seedlings } } : {} },
    species: [{ key: 'x', name: f.scientificName, plants: opts.plants ?? 25, cultivars: false, facts: f }],
  })
}
const one = (facts: Partial<SeedFacts>, opts?: Parameters<typeof plan>[1]) => plan(facts, opts).species[0]!

describe('pots, seeds and seedlings', () => {
  it('pots = ceil(plants × (1 + margin) ÷ seedlings per pot)', () => {
    // 25 × 1.2 = 30 → 3 pots of 10; 26 × 1.2 = 31.2 → 4
    expect(potsNeeded(25, 10, 0.2)).toBe(3)
    expect(potsNeeded(26, 10, 0.2)).toBe(4)
    expect(potsNeeded(0, 10, 0.2)).toBe(0)
    fc.assert(fc.property(fc.integer({ min: 1, max: 10_000 }), fc.integer({ min: 1, max: 40 }), fc.double({ min: 0, max: 1, noNaN: true }), (plants, per, margin) => {
      const pots = potsNeeded(plants, per, margin)
      return pots * per >= plants * (1 + margin) - 1e-6 && (pots - 1) * per < plants * (1 + margin)
    }))
  })

  it('never plans more seedlings than seeds, whatever the seedlings a pot', () => {
    // Sparganium eurycarpum: USDA PLANTS 1,468 seeds a pound; the catalogue's old figure was 4 seedlings a pot
    const s = one({ scientificName: 'Sparganium eurycarpum', coldStratification: false, coldMoistDays: 0, seedsPerPound: 1_468, seedlingsPerPot: 4 })
    // 4 seedlings ÷ a germination share of 0.5 (common practice) = 8 seeds a pot
    expect(s.seedsPerPot).toBe(8)
    fc.assert(fc.property(fc.integer({ min: 1, max: 100 }), fc.integer({ min: 1, max: 5000 }), fc.option(fc.integer({ min: 1, max: 20_000_000 })), (seedlings, plants, spp) => {
      const p = one({ seedsPerPound: spp }, { seedlings, plants })
      return p.seeds >= p.pots * p.seedlingsPerPot && p.pots * p.seedlingsPerPot >= plants
    }))
  })

  it('counts points and drifts in a triangular layout', () => {
    const counts = plantsBySpecies([
      { species: 'Echinacea purpurea', count: 3 },
      { species: 'echinacea  purpurea' },
      // 10 m² at 0.5 m: 10 ÷ (0.866 × 0.25) = 46.19 → 47 (one plant per (√3/2)·s²)
      { species: 'Carex pensylvanica', points: [[0, 0], [5, 0], [5, 2], [0, 2]], spacing: 0.5 },
      { species: 'Carex pensylvanica', points: [[0, 0], [1, 0], [1, 1], [0, 1]], spacing: null },
    ], () => 1)
    expect(counts.get('echinacea purpurea')!.plants).toBe(4)
    expect(counts.get('carex pensylvanica')!.plants).toBe(47)
  })
})

describe('only natives are raised', () => {
  it('raises species native in the region, never "native and introduced", introduced, invasive or absent ones', () => {
    // USDA PLANTS native status: Poa pratensis L48(I,N) — counted as not native, so not raised
    expect(REGION_STATUSES.filter(raisedFromSeed)).toEqual(['native'])
  })

  it('grows every native by default unless USDA says it is not propagated by seed', () => {
    expect(growsFromSeedByDefault({ propagatedBySeed: null })).toBe(true)
    expect(growsFromSeedByDefault({ propagatedBySeed: false })).toBe(false)
  })
})

describe('the season', () => {
  it('runs until the first fall frost: pot-up and plant-out stay after the last spring frost', () => {
    // Ohio yard, last frost 04-25, first frost 10-15. On 2027-05-01 the 2027 season is still running.
    const p = plan({}, { today: '2027-05-01' })
    expect(p.season.year).toBe(2027)
    const s = p.species[0]!
    // germination by the last frost, 2027-04-25; pot up 42 days later: 25 Apr + 42 d = 6 Jun (hand count)
    expect(s.potUp).toBe('2027-06-06')
    // plant out from 6 weeks before the first frost: 15 Oct − 42 d = 3 Sep; by 2 weeks before: 1 Oct
    expect(s.plantOut).toBe('2027-09-03')
    expect(s.plantOutBy).toBe('2027-10-01')
    expect(p.tasks.some((t) => t.kind === 'plant-out' && t.date === '2027-09-03')).toBe(true)
    // the spring sowing window (14 days either side of the last frost) is still open on 1 May
    const m = plan(milkweed, { today: '2027-05-01' }).species[0]!
    expect([m.sowFrom, m.sowTo]).toEqual(['2027-04-11', '2027-05-09'])
  })

  it('moves to the next season the day after the first fall frost, not before', () => {
    expect(plan({}, { today: '2027-10-15' }).season.year).toBe(2027)
    expect(plan({}, { today: '2027-10-16' }).season.year).toBe(2028)
    expect(plan({}, { today: '2027-10-16' }).season.ends).toBe('2028-10-15')
  })
})

describe('cold need', () => {
  it('sows seed needing a cold period outdoors in late fall to early winter, with its days before the last frost', () => {
    const s = one({})
    // 14 days after the 2026-10-15 frost; until 15 January, which leaves 100 ≥ 60 days before 2027-04-25
    expect([s.sowFrom, s.sowTo]).toEqual(['2026-10-29', '2027-01-15'])
    expect(daysBetween(s.sowTo!, '2027-04-25')).toBeGreaterThanOrEqual(60)
    // refrigerator route: 60 days at 1–5 °C ending at the last frost (Agriculture Handbook 727: cold-moist 30–90 days at 1–5 °C)
    expect([s.fridgeStart, s.fridgeSow]).toEqual(['2027-02-24', '2027-04-25'])
    expect(s.treatment.join(' ')).toMatch(/60 days at about 1–5 °C/)
  })

  it('plans seed whose cold need is not recorded as outdoor fall to early-winter sowing, and says why', () => {
    const s = one(aster)
    expect(s.coldNeed).toBe('unknown')
    expect(s.route).toBe('outdoor-winter')
    expect([s.sowFrom, s.sowTo]).toEqual(['2026-10-29', '2027-01-15'])
    const words = s.treatment.join(' ')
    expect(words).toMatch(/not recorded/)
    expect(words).toMatch(/does it no harm/)
    // size unknown: a thin cover of coarse sand (common practice)
    expect(s.depth).toBe('sand')
  })

  it('sows seed known to need none in early spring, or in late fall as the other choice', () => {
    const s = one(milkweed)
    expect(s.route).toBe('spring')
    expect([s.sowFrom, s.sowTo]).toEqual(['2027-04-11', '2027-05-09'])
    // late fall: 2 to 6 weeks after the 2026-10-15 frost = 29 Oct to 26 Nov (hand count)
    expect([s.altSowFrom, s.altSowTo]).toEqual(['2026-10-29', '2026-11-26'])
    expect(s.treatment.join(' ')).toMatch(/part shade out of hot afternoon sun/)
    const p = plan(milkweed)
    expect(p.tasks.find((t) => t.kind === 'sow-fall')!.optional).toBe(true)
    expect(p.tasks.find((t) => t.kind === 'sow-spring')!.optional).toBe(false)
  })

  it("lets a coordinator's cold-moist days win over USDA's flag", () => {
    const c = coldNeedOf({ layer: 'ground', coldStratification: false, coldMoistDays: 30, sources: { coldMoistDays: 'Prairie seed notes 2024' } })
    expect(c).toMatchObject({ need: 'needed', days: 30, source: 'coordinator' })
    expect(coldNeedOf({ layer: 'ground', coldStratification: true, coldMoistDays: 0, sources: { coldMoistDays: 'coordinator' } }).need).toBe('none')
    // USDA's own answer otherwise
    expect(coldNeedOf({ layer: 'ground', coldStratification: false, coldMoistDays: 0, sources: { coldMoistDays: 'USDA PLANTS' } }).need).toBe('none')
    expect(coldNeedOf({ layer: 'ground', coldStratification: null, coldMoistDays: null }).need).toBe('unknown')
  })
})

describe('seed sown fresh', () => {
  it('sows white-oak acorns in fall as collected, deep and under hardware cloth, never stored to spring', () => {
    const s = one(whiteOak)
    expect(s.route).toBe('fresh')
    // 4 weeks either side of the 2026-10-15 frost: 17 Sep to 12 Nov (hand count)
    expect([s.sowFrom, s.sowTo]).toEqual(['2026-09-17', '2026-11-12'])
    expect(s.depth).toBe('deep')
    expect(s.treatment.join(' ')).toMatch(/never store it dry/)
    expect(s.tagTreatment).toMatch(/2–3 cm deep, under hardware cloth/)
    // no spring sowing offered
    expect(s.altSowFrom).toBeNull()
    expect(plan(whiteOak).tasks.some((t) => t.kind === 'sow-spring')).toBe(false)
  })
})

describe('plant-out', () => {
  it('is from six to two weeks before the first fall frost, never before pot-up', () => {
    // common practice: in September where the first frost comes in early October (here 2027-10-05)
    const s = one({}, { frost: { ...ohio, firstFall: '10-05' }, today: '2027-03-01' })
    expect(s.plantOut).toBe('2027-08-24')
    expect(s.plantOutBy).toBe('2027-09-21')
    // a short season: spring sowing ends 05-18 + 14 d = 06-01, germination by two weeks later (06-15), pot-up 42 d on
    // (07-27), which is later than 6 weeks before a 08-20 frost (07-09): plant out when potted up, by 08-06
    const short = one(milkweed, { frost: { ...ohio, lastSpring: '05-18', firstFall: '08-20' }, today: '2027-03-01' })
    expect(short.potUp).toBe('2027-07-27')
    expect(short.plantOut).toBe('2027-07-27')
    expect(short.plantOutBy).toBe('2027-08-06')
  })
})

describe('frost-free places', () => {
  it('get a cool-season plan with a note, dates in order', () => {
    const frost = frostDates({ zone: '11a' })
    const p = plan(milkweed, { frost, today: '2026-12-01' })
    expect(p.season.frostFree).toBe(true)
    expect(p.season.note).toMatch(/cool season/)
    const s = p.species[0]!
    expect([s.sowFrom, s.sowTo]).toEqual(['2026-10-15', '2026-11-30'])
    expect(s.plantOutBy).toBe('2027-02-28')
    // seed needing cold: the refrigerator, as winters give none
    expect(one({}, { frost }).route).toBe('fridge')
  })
})

// ---------------------------------------------------------------------------------------------------------------
// Property: each species' tasks come in order, over every zone 3a–11b and the full range of frost dates

const ZONES = Array.from({ length: 9 }, (_, i) => i + 3).flatMap((n) => [`${n}a`, `${n}b`])
const monthDayArb = fc.integer({ min: 0, max: 364 }).map((d) => isoDate(addDays(parseIsoDate('2027-01-01'), d)).slice(5))
const frostArb = fc.record({ zone: fc.constantFrom(...ZONES), last: fc.option(monthDayArb), first: fc.option(monthDayArb) })
  .map(({ zone, last, first }) => frostDates({ zone, lastSpringFrost: last, firstFallFrost: first }))
const factsArb = fc.record({
  coldStratification: fc.constantFrom(true, false, null),
  coldMoistDays: fc.option(fc.integer({ min: 0, max: 150 })),
  coordinator: fc.boolean(),
  sowFresh: fc.boolean(),
  seedsPerPound: fc.option(fc.integer({ min: 50, max: 20_000_000 })),
  layer: fc.constantFrom('ground', 'shrub', 'tree' as const),
})
const todayArb = fc.integer({ min: 0, max: 4 * 365 }).map((d) => isoDate(addDays(parseIsoDate('2025-01-01'), d)))

function checkOrder(p: SeedPlan, s: SpeciesPlan, today: string) {
  const le = (a: string | null, b: string | null, what: string) => {
    if (a && b && a > b) throw new Error(`${what}: ${a} after ${b} (${s.route}, ${JSON.stringify(p.frost)}, today ${today})`)
  }
  const firstAction = [s.sowFrom, s.fridgeStart].filter(Boolean).sort()[0] ?? null
  const prepare = p.tasks.find((t) => t.kind === 'prepare')!
  le(prepare.date, firstAction, 'prepare before sowing')
  le(s.sowFrom, s.sowTo, 'sowing window')
  le(s.fridgeStart, s.fridgeSow, 'refrigerator')
  // the cold period between sowing and germination
  if (s.coldMoistDays > 0 && s.sowTo && (s.route === 'outdoor-winter' || s.route === 'fresh')) le(isoDate(addDays(parseIsoDate(s.sowTo), s.coldMoistDays)), s.germinationFrom, 'cold period before germination')
  if (s.coldMoistDays > 0 && s.fridgeStart && s.route !== 'outdoor-winter' && daysBetween(s.fridgeStart, s.fridgeSow!) < s.coldMoistDays) throw new Error('refrigerator shorter than the cold period')
  le(s.sowFrom, s.germinationFrom, 'sowing before germination')
  le(s.sowTo, s.germination, 'sowing ends before germination ends')
  if (s.route !== 'outdoor-winter') le(s.fridgeSow, s.germinationFrom, 'refrigerated sowing before germination')
  le(s.germinationFrom, s.germination, 'germination window')
  le(s.germination, s.potUp, 'pot up after germination')
  le(s.potUp, s.plantOut, 'plant out after pot-up')
  le(s.plantOut, s.plantOutBy, 'plant-out window')
  le(today, p.season.ends, 'the season shown has not ended')
  // the tasks naming the species, by kind
  const dateOf = (kind: string) => p.tasks.filter((t) => t.kind === kind && t.species.includes(s.scientificName)).map((t) => t.date).sort()[0] ?? null
  const sow = ['sow-fresh', 'sow-cold', 'sow-spring', 'sow-cool', 'fridge-start'].map(dateOf).filter(Boolean).sort()[0] ?? null
  le(prepare.date, sow, 'prepare task before sow task')
  le(sow, dateOf('germination'), 'sow task before germination task')
  le(dateOf('germination'), dateOf('pot-up'), 'germination task before pot-up task')
  le(dateOf('pot-up'), dateOf('plant-out'), 'pot-up task before plant-out task')
  if (!p.season.frostFree && !s.notes.some((n) => /short season/.test(n))) {
    // plant out from 6 to 2 weeks before the first fall frost (common practice)
    expect(daysBetween(s.plantOut, p.season.firstFallFrost!)).toBeLessThanOrEqual(42)
    expect(daysBetween(s.plantOutBy, p.season.firstFallFrost!)).toBe(14)
  }
}

describe('task order over zones and frost dates (property)', () => {
  it('prepare → sow → (cold period) → germination → pot up → plant out, for every species', () => {
    fc.assert(fc.property(frostArb, factsArb, todayArb, (frost, f, today) => {
      const facts: Partial<SeedFacts> = {
        coldStratification: f.coldStratification, coldMoistDays: f.coldMoistDays, sowFresh: f.sowFresh, seedsPerPound: f.seedsPerPound, layer: f.layer,
        sources: f.coordinator ? { coldMoistDays: 'coordinator' } : {},
      }
      const p = plan(facts, { frost, today })
      const s = p.species[0]!
      if (frost.lastSpring && frost.firstFall) expect(frost.lastSpring < frost.firstFall).toBe(true)
      checkOrder(p, s, today)
    }), { numRuns: 2000 })
  }, 120_000)
})
