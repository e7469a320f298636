/**
 * Seed size: one class per range of USDA PLANTS' "seeds per pound", and everything that follows from it: how deep
 * to sow, how many seedlings a 10 cm (4-inch) pot gives, how many seeds to sow in it. The catalogue's default
 * seedlings per pot and the seed plan's seeds per pot both come from here, so a pot never expects more seedlings
 * than seeds. Class limits, depths and counts are common practice for raising natives in pots, unless noted.
 */
import type { Layer } from '../types/species'

/** grams in one international avoirdupois pound (exact since 1959; NIST Handbook 44) */
export const GRAMS_PER_POUND = 453.59237
/** share of sown seed expected to give a seedling: plan on about half (common practice for cleaned native seed) */
export const GERMINATION_SHARE = 0.5
/** thin cover of coarse sand over small seed, mm (about 1/8 inch) */
export const SAND_COVER_MM = 3
/** very large seed (acorns, nuts, buckeyes) is sown this deep, cm (about an inch) */
export const DEEP_SOW_CM = [2, 3] as const
/** the density assumed to turn a seed's mass into its thickness (g/cm³; water, a rough figure for seed) */
export const SEED_DENSITY = 1

export type SowDepth = 'surface' | 'sand' | 'own-thickness' | 'deep'
export type SeedSizeName = 'dust-fine' | 'small' | 'medium' | 'large' | 'very large' | 'unknown'

export interface SeedSizeClass {
  name: SeedSizeName
  /** lowest seeds per pound in the class (largest count first) */
  minSeedsPerPound: number
  depth: SowDepth
  /** most seedlings one 10 cm pot is planned to give for seed of this size */
  maxSeedlingsPerPot: number
}

/**
 * Dust-fine seed (≥ 1,000,000 a pound, under about 0.5 mg) is sown on the surface, uncovered; small seed gets a
 * thin layer of coarse sand; medium and large seed is pressed in and covered to about its own thickness; very large
 * seed (under 2,000 a pound, over about 0.23 g) is sown 2–3 cm deep under hardware cloth, one seedling to a pot.
 */
export const SEED_SIZE_CLASSES: readonly SeedSizeClass[] = [
  { name: 'dust-fine', minSeedsPerPound: 1_000_000, depth: 'surface', maxSeedlingsPerPot: 12 },
  { name: 'small', minSeedsPerPound: 200_000, depth: 'sand', maxSeedlingsPerPot: 12 },
  { name: 'medium', minSeedsPerPound: 20_000, depth: 'own-thickness', maxSeedlingsPerPot: 12 },
  { name: 'large', minSeedsPerPound: 2_000, depth: 'own-thickness', maxSeedlingsPerPot: 4 },
  { name: 'very large', minSeedsPerPound: 0, depth: 'deep', maxSeedlingsPerPot: 1 },
]
/** size not recorded: a thin sand cover, which suits most seed, and the layer's own seedlings a pot */
export const UNKNOWN_SEED_SIZE: SeedSizeClass = { name: 'unknown', minSeedsPerPound: Number.NaN, depth: 'sand', maxSeedlingsPerPot: 12 }

/** Seedlings a 10 cm pot gives when sown and pricked out, by layer: perennials and grasses 12, shrubs 6, trees 3. */
export const LAYER_SEEDLINGS_PER_POT: Record<Layer, number> = { ground: 12, shrub: 6, tree: 3 }

export function seedSizeClass(seedsPerPound: number | null | undefined): SeedSizeClass {
  if (seedsPerPound === null || seedsPerPound === undefined || !(seedsPerPound > 0)) return UNKNOWN_SEED_SIZE
  return SEED_SIZE_CLASSES.find((c) => seedsPerPound >= c.minSeedsPerPound)!
}

/** Default seedlings a pot: the layer's figure, capped by what seed of that size gives. */
export function seedlingsPerPotFor(layer: Layer, seedsPerPound: number | null): number {
  return Math.min(LAYER_SEEDLINGS_PER_POT[layer], seedSizeClass(seedsPerPound).maxSeedlingsPerPot)
}

/** Seeds to sow in a pot for the seedlings wanted from it: seedlings ÷ the germination share, rounded up. */
export function seedsPerPotFor(seedlingsPerPot: number): number {
  if (!(seedlingsPerPot > 0)) return 0
  return Math.ceil(seedlingsPerPot / GERMINATION_SHARE - 1e-9)
}

/** Grams of `seeds` seeds from USDA's seeds per pound. */
export function gramsForSeeds(seeds: number, seedsPerPound: number | null): number | null {
  if (seedsPerPound === null || !(seedsPerPound > 0)) return null
  return (seeds * GRAMS_PER_POUND) / seedsPerPound
}

/** A seed's thickness in mm, taken as a sphere of its mass (from seeds per pound) at SEED_DENSITY: a rough estimate. */
export function seedThicknessMm(seedsPerPound: number): number {
  const grams = GRAMS_PER_POUND / seedsPerPound
  return 10 * Math.cbrt((6 * grams) / (Math.PI * SEED_DENSITY))
}

export interface Sowing { depth: SowDepth; size: SeedSizeName; /** cover, mm, where one is given */ coverMm: number | null; words: string; tag: string }

/**
 * How to sow: from the seed's size, unless the catalogue says the seed needs light (surface) or does not (then
 * dust-fine seed gets the thin sand cover instead).
 */
export function sowingFor(seedsPerPound: number | null, needsLight: boolean | null): Sowing {
  const cls = seedSizeClass(seedsPerPound)
  let depth = cls.depth
  if (needsLight === true) depth = 'surface'
  else if (needsLight === false && depth === 'surface') depth = 'sand'
  switch (depth) {
    case 'surface':
      return { depth, size: cls.name, coverMm: null, words: 'Sow on the surface and leave it uncovered: seed this fine needs light to germinate. Press it gently onto the mix.', tag: 'surface-sown, uncovered' }
    case 'sand':
      return { depth, size: cls.name, coverMm: SAND_COVER_MM, words: `Cover with a thin layer (about ${SAND_COVER_MM} mm, 1/8 inch) of coarse sand, which keeps the seed moist and in place.`, tag: `under ${SAND_COVER_MM} mm coarse sand` }
    case 'own-thickness': {
      const mm = Math.max(2, Math.round(seedThicknessMm(seedsPerPound!)))
      return { depth, size: cls.name, coverMm: mm, words: `Press the seed in and cover it to about its own thickness (roughly ${mm} mm) with mix or coarse sand.`, tag: `covered about ${mm} mm` }
    }
    case 'deep':
      return { depth, size: cls.name, coverMm: DEEP_SOW_CM[0] * 10, words: `Sow ${DEEP_SOW_CM[0]}–${DEEP_SOW_CM[1]} cm (about 1 inch) deep, one seed to a deep pot, and fix hardware cloth (about 6 mm, 1/4-inch mesh) over the pot: mice and squirrels dig up large seed.`, tag: `${DEEP_SOW_CM[0]}–${DEEP_SOW_CM[1]} cm deep, under hardware cloth` }
  }
}
