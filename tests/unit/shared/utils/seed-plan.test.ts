import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import {
  potsNeeded, gramsForSeeds, GRAMS_PER_POUND, DEFAULT_SEEDLINGS_PER_POT, SEEDLINGS_PER_POT_RANGE, DEFAULT_MARGIN,
  computeSeedPlan, frostDates, seasonYear, daysBetween, plantsBySpecies, seedsPerPotFor, seedlingsPerPotFor,
  treatmentSteps, type SeedFacts, type FrostDates, ZONE_FROST_DEFAULTS,
} from '#shared/utils/seed-plan'

const base: SeedFacts = {
  scientificName: 'Echinacea purpurea', commonName: 'purple coneflower', layer: 'ground', spacing: 0.45,
  propagatedBySeed: true, coldStratification: true, coldMoistDays: 60, seedNeedsLight: false, scarify: false,
  hotWaterSoak: false, seedsPerPound: 115_664, seedlingsPerPot: null,
}
const ohio: FrostDates = { lastSpring: '04-25', firstFall: '10-15', rough: false, source: 'yard', outdoorCold: true, zone: '6a' }

function plan(facts: Partial<SeedFacts>, opts: { plants?: number; today?: string; frost?: FrostDates; margin?: number; seedlings?: number } = {}) {
  const f = { ...base, ...facts }
  return computeSeedPlan({
    today: opts.today ?? '2026-12-01',
    frost: opts.frost ?? ohio,
    settings: { margin: opts.margin ?? DEFAULT_MARGIN, species: opts.seedlings ? { x: { seedlingsPerPot: opts.seedlings } } : {} },
    species: [{ key: 'x', name: f.scientificName, plants: opts.plants ?? 25, cultivars: false, facts: f }],
  })
}

describe('pots', () => {
  it('pots = ceil(plants × (1 + margin) ÷ seedlings per pot)', () => {
    // the formula of the seed-plan rules (issue 6); 25 × 1.2 = 30 → 3 pots of 10, 26 × 1.2 = 31.2 → 4
    expect(potsNeeded(25, 10, 0.2)).toBe(3)
    expect(potsNeeded(26, 10, 0.2)).toBe(4)
    expect(potsNeeded(10, 12, 0)).toBe(1)
    expect(potsNeeded(0, 10, 0.2)).toBe(0)
    fc.assert(fc.property(fc.integer({ min: 1, max: 10_000 }), fc.integer({ min: 1, max: 40 }), fc.double({ min: 0, max: 1, noNaN: true }), (plants, per, margin) => {
      const pots = potsNeeded(plants, per, margin)
      // enough seedlings with the margin, and one pot fewer would not be
      return pots * per >= plants * (1 + margin) - 1e-6 && (pots - 1) * per < plants * (1 + margin)
    }))
  })

  it('a 10 cm pot gives 10 seedlings by default, inside the 10–15 rule of thumb', () => {
    // common practice (no published source): a 10 cm / 4-inch pot of sown seed gives about 10–15 seedlings
    expect(DEFAULT_SEEDLINGS_PER_POT).toBe(10)
    expect(DEFAULT_SEEDLINGS_PER_POT).toBeGreaterThanOrEqual(SEEDLINGS_PER_POT_RANGE[0])
    expect(DEFAULT_SEEDLINGS_PER_POT).toBeLessThanOrEqual(SEEDLINGS_PER_POT_RANGE[1])
    expect(plan({}).species[0]!.seedlingsPerPot).toBe(10)
    // spare margin 20 % by default (common practice)
    expect(DEFAULT_MARGIN).toBe(0.2)
  })

  it('the plan override beats the catalogue figure, which beats the default', () => {
    expect(seedlingsPerPotFor({ seedlingsPerPot: null, seedsPerPound: 115_664 })).toEqual({ value: 10, source: 'default' })
    expect(seedlingsPerPotFor({ seedlingsPerPot: 15, seedsPerPound: 115_664 })).toEqual({ value: 15, source: 'catalogue' })
    expect(seedlingsPerPotFor({ seedlingsPerPot: 15, seedsPerPound: 115_664 }, 12)).toEqual({ value: 12, source: 'plan' })
    // acorns: USDA PLANTS gives Quercus alba 128 seeds per pound (plant_characteristics, QUAL): one to a pot
    expect(seedlingsPerPotFor({ seedlingsPerPot: null, seedsPerPound: 128 })).toEqual({ value: 1, source: 'very large seed' })
    const p = plan({}, { plants: 30, seedlings: 15 })
    // 30 × 1.2 = 36 → 36 ÷ 15 = 2.4 → 3 pots
    expect(p.species[0]!.pots).toBe(3)
  })
})

describe('seed weight', () => {
  it('uses the exact international pound', () => {
    // 1 lb = 453.59237 g exactly: NIST Handbook 44, Appendix C (the 1959 international yard and pound)
    expect(GRAMS_PER_POUND).toBe(453.59237)
    expect(gramsForSeeds(1000, 1000)).toBeCloseTo(453.59237, 10)
    expect(gramsForSeeds(100, null)).toBeNull()
  })

  it('turns USDA seeds per pound into grams for the seeds to sow', () => {
    // Echinacea purpurea: 115,664 seeds per pound (USDA PLANTS plant_characteristics, ECPU), medium seed → 25 a pot
    const s = plan({}, { plants: 25 }).species[0]!
    expect(s.seedsPerPot).toBe(25)
    expect(s.seeds).toBe(3 * 25)
    // 75 × 453.59237 ÷ 115,664 = 0.29413 g (hand calculation from the two published figures)
    expect(s.grams).toBeCloseTo(0.294, 3)
    expect(seedsPerPotFor(11_292_758).seedsPerPot).toBe(60) // Lobelia cardinalis, USDA LOCA2: dust-fine
    expect(seedsPerPotFor(null)).toEqual({ seedsPerPot: 30, guessed: true })
  })
})

describe('dates', () => {
  it('the coming season is the next last spring frost on or after today', () => {
    expect(seasonYear('2026-12-01', '04-25')).toBe(2027)
    expect(seasonYear('2027-04-25', '04-25')).toBe(2027)
    expect(seasonYear('2027-04-26', '04-25')).toBe(2028)
  })

  it('the cold period fits between the sow date and the last spring frost', () => {
    const zones = Object.keys(ZONE_FROST_DEFAULTS).map(Number).filter((z) => z >= 3 && z <= 8)
    fc.assert(fc.property(
      fc.constantFrom(...zones), fc.integer({ min: 1, max: 150 }), fc.integer({ min: 0, max: 729 }),
      (zone, days, offset) => {
        const frost = frostDates({ zone: `${zone}a` })
        const today = new Date(Date.UTC(2026, 0, 1) + offset * 86_400_000).toISOString().slice(0, 10)
        const p = plan({ coldMoistDays: days }, { frost, today })
        const s = p.species[0]!
        // outdoors: even the last sowing day leaves winter at least N days before the last frost
        expect(daysBetween(s.sowTo!, p.season.lastSpringFrost)).toBeGreaterThanOrEqual(days)
        expect(s.sowFrom! <= s.sowTo!).toBe(true)
        // refrigerator: N days between putting the seed in and sowing it
        expect(daysBetween(s.fridgeStart!, s.fridgeSow!)).toBeGreaterThanOrEqual(days)
        expect(s.fridgeStart! >= today).toBe(true)
      },
    ))
  })

  it('sows cold-period seed in late fall to early winter, the rest in early spring', () => {
    const p = plan({ coldMoistDays: 60 })
    const s = p.species[0]!
    expect(p.season.year).toBe(2027)
    // the yard's first fall frost 10-15 + 14 days; until 15 January (60 days before 04-25 is 02-24, later)
    expect(s.sowFrom).toBe('2026-10-29')
    expect(s.sowTo).toBe('2027-01-15')
    expect(s.fridgeStart).toBe('2027-02-24')
    expect(s.fridgeSow).toBe('2027-04-25')
    const long = plan({ coldMoistDays: 120 }).species[0]!
    // 120 days before 2027-04-25 is 2026-12-26, earlier than 15 January
    expect(long.sowTo).toBe('2026-12-26')

    const warm = plan({ coldStratification: false, coldMoistDays: 0 }).species[0]!
    expect(warm.coldMoistDays).toBe(0)
    expect(warm.sowFrom).toBe('2027-04-11')
    expect(warm.sowTo).toBe('2027-05-09')
    expect(warm.fridgeStart).toBeNull()
    expect(warm.treatment.join(' ')).toMatch(/part shade/)
  })

  it('starts the refrigerator today when its date has passed', () => {
    const s = plan({ coldMoistDays: 60 }, { today: '2027-03-10' }).species[0]!
    expect(s.fridgeStart).toBe('2027-03-10')
    expect(s.fridgeSow).toBe('2027-05-09')
  })

  it('plants out at least 42 days before the first fall frost', () => {
    // six weeks before the first fall frost, so roots establish before frost heave (common practice)
    fc.assert(fc.property(fc.integer({ min: 1, max: 13 }), fc.integer({ min: 0, max: 150 }), (zone, days) => {
      const p = plan({ coldMoistDays: days, coldStratification: days > 0 }, { frost: frostDates({ zone: `${zone}b` }) })
      const s = p.species[0]!
      expect(daysBetween(s.plantOutBy, p.season.firstFallFrost)).toBeGreaterThanOrEqual(42)
      expect(daysBetween(s.plantOut, p.season.firstFallFrost)).toBeGreaterThanOrEqual(42)
    }))
    expect(plan({}).species[0]!.plantOutBy).toBe('2027-09-03')
  })

  it('marks zone defaults as rough and uses the refrigerator where winters are mild', () => {
    expect(frostDates({ lastSpringFrost: '04-20', firstFallFrost: '10-20', zone: '6a' })).toMatchObject({ rough: false, source: 'yard' })
    expect(frostDates({ zone: '5b' })).toMatchObject({ rough: true, source: 'zone', lastSpring: '05-05' })
    expect(frostDates({})).toMatchObject({ rough: true, source: 'fallback' })
    const mild = plan({ coldMoistDays: 30 }, { frost: frostDates({ zone: '10a' }) }).species[0]!
    expect(mild.sowFrom).toBeNull()
    expect(mild.fridgeStart).not.toBeNull()
  })
})

describe('sowing depth and treatment', () => {
  it('surface-sows exactly the seed that needs light', () => {
    for (const light of [true, false, null]) {
      const s = plan({ seedNeedsLight: light }).species[0]!
      expect(s.surfaceSow).toBe(light === true)
      const text = s.treatment.join(' ')
      expect(/on the surface and leave it uncovered/.test(text)).toBe(light === true)
      expect(/coarse sand/.test(text.replace(/damp sand/g, ''))).toBe(light !== true)
    }
  })

  it('says each need in words and numbers', () => {
    const steps = treatmentSteps({ coldMoistDays: 90, coldNeedKnown: true, scarify: true, hotWaterSoak: true, surfaceSow: false })
    expect(steps[0]).toMatch(/Scarify/)
    expect(steps[1]).toMatch(/Hot-water soak.*80–90 °C/)
    expect(steps[2]).toMatch(/90 days at about 1–5 °C/)
    expect(steps[2]).toMatch(/refrigerator in a sealed, labelled bag|sealed, labelled bag in a refrigerator/)
    // no seller's letter codes such as "C(60)" or "L"
    expect(steps.join(' ')).not.toMatch(/\b[A-Z]\(\d+\)|\b[A-Z]\d{2}\b/)
  })
})

describe('plants needed and totals', () => {
  it('counts points and drifts in a triangular layout', () => {
    const counts = plantsBySpecies([
      { species: 'Echinacea purpurea', count: 3 },
      { species: 'echinacea  purpurea' },
      // 10 m² at 0.5 m: 10 ÷ (0.866 × 0.25) = 46.19 → 47 (triangular layout: one plant per (√3/2)·s²)
      { species: 'Carex pensylvanica', points: [[0, 0], [5, 0], [5, 2], [0, 2]], spacing: 0.5 },
      // spacing from the species when the drift has none; a sown drift (spacing null) has no plants to raise
      { species: 'Carex pensylvanica', points: [[0, 0], [1, 0], [1, 1], [0, 1]] },
      { species: 'Carex pensylvanica', points: [[0, 0], [1, 0], [1, 1], [0, 1]], spacing: null },
    ], () => 1)
    expect(counts.get('echinacea purpurea')!.plants).toBe(4)
    // 1 m² at 1 m: 1 ÷ 0.866 = 1.15 → 2
    expect(counts.get('carex pensylvanica')!.plants).toBe(47 + 2)
  })

  it('totals pots, potting mix, sand and priced seed', () => {
    const p = computeSeedPlan({
      today: '2026-12-01', frost: ohio, settings: { margin: 0.2, species: { b: { grow: false } } },
      species: [
        { key: 'a', name: 'A a', plants: 25, cultivars: false, facts: { ...base, scientificName: 'A a' } },
        { key: 'b', name: 'B b', plants: 100, cultivars: false, facts: { ...base, scientificName: 'B b' } },
        { key: 'c', name: 'C c', plants: 9, cultivars: true, facts: { ...base, scientificName: 'C c', seedNeedsLight: true } },
      ],
      prices: new Map([['a', 4]]),
    })
    expect(p.totals.species).toBe(2)
    expect(p.totals.pots).toBe(3 + 2)
    // 0.8 L a pot (10 × 10 × 8 cm); sand only over the 3 covered pots, 0.03 L each
    expect(p.totals.pottingMixLitres).toBe(4)
    expect(p.totals.sandLitres).toBe(0.09)
    expect(p.totals.cost).toBeCloseTo(4 * p.species[0]!.grams!, 2)
    expect(p.totals.unpricedSpecies).toBe(1)
    expect(p.species.find((s) => s.key === 'c')!.notes.join(' ')).toMatch(/do not come true/)
    const kinds = new Set(p.tasks.map((t) => t.kind))
    for (const k of ['prepare', 'sow-cold', 'protect', 'check-moisture', 'germination', 'pot-up', 'plant-out']) expect(kinds.has(k as never)).toBe(true)
    expect(p.tasks.every((t) => !t.species.includes('B b'))).toBe(true)
    expect(p.tasks.find((t) => t.kind === 'prepare')!.detail).toMatch(/pencil/)
  })
})
