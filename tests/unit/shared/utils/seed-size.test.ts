import { describe, it, expect } from 'vitest'
import { gunzipSync } from 'node:zlib'
import { readFileSync } from 'node:fs'
import {
  seedSizeClass, sowingFor, seedsPerPotFor, seedlingsPerPotFor, seedThicknessMm, gramsForSeeds, GRAMS_PER_POUND, GERMINATION_SHARE,
} from '#shared/utils/seed-size'
import { seedlingsPerPotOf } from '#shared/utils/seed-plan'
import { defaultSeedlingsPerPot, type CatalogueEntry } from '#shared/utils/catalogue-rules'

describe('sowing depth from seed size (USDA PLANTS "seeds per pound")', () => {
  it('dust-fine seed on the surface, small seed under thin coarse sand, larger seed at its own thickness, very large seed deep', () => {
    // Lobelia cardinalis, USDA PLANTS seed_per_pound 11,292,758: dust-fine, sown on the surface uncovered (common practice)
    expect(sowingFor(11_292_758, null).depth).toBe('surface')
    // 500,000 a pound is about 0.9 mg a seed: small, a thin layer (about 3 mm) of coarse sand (common practice)
    expect(sowingFor(500_000, null)).toMatchObject({ depth: 'sand', coverMm: 3 })
    // Echinacea purpurea, USDA PLANTS 115,664 a pound: 453.59237 / 115,664 = 3.92 mg; a sphere of water of that mass is
    // (6 × 0.00392 / π)^(1/3) = 0.196 cm across → covered about 2 mm (hand calculation)
    expect(sowingFor(115_664, null)).toMatchObject({ depth: 'own-thickness', coverMm: 2 })
    // 20,000 a pound: 22.7 mg → (6 × 0.0227 / π)^(1/3) = 0.351 cm → about 4 mm (hand calculation)
    expect(seedThicknessMm(20_000)).toBeCloseTo(3.51, 2)
    // Quercus alba, USDA PLANTS 128 a pound (3.5 g acorns): 2–3 cm deep under hardware cloth (Agriculture Handbook 727, Quercus: acorns sown about an inch deep and protected from rodents)
    const oak = sowingFor(128, null)
    expect(oak.depth).toBe('deep')
    expect(oak.words).toMatch(/2–3 cm/)
    expect(oak.words).toMatch(/hardware cloth/)
  })

  it('follows the catalogue where it says the seed needs light, or does not', () => {
    expect(sowingFor(50_000, true).depth).toBe('surface')
    expect(sowingFor(2_000_000, false).depth).toBe('sand')
    // size not recorded: the thin sand cover that suits most seed (common practice)
    expect(sowingFor(null, null)).toMatchObject({ depth: 'sand', size: 'unknown' })
  })

  it('puts each class boundary where the rule names it', () => {
    // limits of the rule (common practice): 1,000,000 / 200,000 / 20,000 / 2,000 seeds a pound
    expect(seedSizeClass(1_000_000).name).toBe('dust-fine')
    expect(seedSizeClass(999_999).name).toBe('small')
    expect(seedSizeClass(200_000).name).toBe('small')
    expect(seedSizeClass(19_999).name).toBe('large')
    expect(seedSizeClass(1_999).name).toBe('very large')
    expect(seedSizeClass(0).name).toBe('unknown')
  })
})

describe('seeds and seedlings a pot: one size-class rule', () => {
  it('sows seedlings ÷ the germination share, rounded up', () => {
    // about half of sown native seed gives a seedling (common practice): 12 seedlings → 24 seeds, 1 → 2, 5 → 10, 7 → 14
    expect(GERMINATION_SHARE).toBe(0.5)
    expect(seedsPerPotFor(12)).toBe(24)
    expect(seedsPerPotFor(1)).toBe(2)
    expect(seedsPerPotFor(7)).toBe(14)
  })

  it('plans seedlings a pot by layer, capped by seed size', () => {
    // common practice: a 10 cm pot gives about 12 perennials, 6 shrubs, 3 trees; one acorn or nut to a pot
    expect(seedlingsPerPotFor('ground', 115_664)).toBe(12)
    expect(seedlingsPerPotFor('shrub', 50_000)).toBe(6)
    expect(seedlingsPerPotFor('tree', 128)).toBe(1)
    // Sparganium eurycarpum, USDA PLANTS 1,468 a pound: very large seed, one seedling to a pot (and two seeds)
    expect(seedlingsPerPotFor('ground', 1_468)).toBe(1)
    expect(seedsPerPotFor(seedlingsPerPotFor('ground', 1_468))).toBe(2)
    // the catalogue's default is this same rule
    expect(defaultSeedlingsPerPot('ground', 1_468)).toBe(1)
  })

  it('weighs seed with the exact international pound', () => {
    // 1 lb = 453.59237 g exactly: NIST Handbook 44, Appendix C
    expect(GRAMS_PER_POUND).toBe(453.59237)
    // 24 seeds of Echinacea purpurea at 115,664 a pound: 24 × 453.59237 / 115,664 = 0.0941 g (hand calculation)
    expect(gramsForSeeds(24, 115_664)).toBeCloseTo(0.0941, 4)
  })

  it('never expects more seedlings than seeds, for every species in the catalogue', () => {
    const file = JSON.parse(gunzipSync(readFileSync('server/assets/catalogue/catalogue.json.gz')).toString()) as { species: CatalogueEntry[] }
    expect(file.species.length).toBeGreaterThan(10_000)
    const bad: string[] = []
    for (const e of file.species) {
      // the catalogue's own figure, and the default rule for it
      for (const seedlings of [seedlingsPerPotOf(e).value, seedlingsPerPotFor(e.layer, e.seedsPerPound)]) {
        if (!(seedsPerPotFor(seedlings) >= seedlings) || !(seedlings >= 1)) bad.push(e.scientificName)
      }
    }
    expect(bad).toEqual([])
  }, 60_000)
})
