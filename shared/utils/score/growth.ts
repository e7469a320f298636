// Growth over time: a planting goes in at a nursery size and grows toward its mature spread and height over a
// number of years set by its layer and growth rate. Pure; the engine applies it to plantings still to plant.
import type { GrowthRate, Layer } from '../../types/species'
import type { StartSize, YardPlanting } from '../../schemas/yard-document'

/**
 * Years from planting to mature size, per layer and USDA PLANTS growth rate (common practice: perennials
 * "sleep, creep, leap" to full size in their third year; shrubs in 3–10 years; trees in one to three decades).
 */
export const YEARS_TO_MATURITY: Record<Layer, Record<GrowthRate, number>> = {
  ground: { slow: 4, moderate: 3, rapid: 2 },
  shrub: { slow: 10, moderate: 6, rapid: 4 },
  tree: { slow: 30, moderate: 20, rapid: 12 },
}

/** The rate assumed for a species USDA gives none for: the layer's middle value (marked estimated). */
export const DEFAULT_RATE: GrowthRate = 'moderate'

/** Spread and height (metres) of each size at planting (from memory, usual nursery stock). */
export const START_SIZE: Record<StartSize, { spread: number; height: number; label: string }> = {
  seed: { spread: 0.02, height: 0.02, label: 'Seed' },
  plug: { spread: 0.05, height: 0.1, label: 'Plug' },
  pot: { spread: 0.25, height: 0.3, label: '1-gallon pot' },
  'bare-root': { spread: 0.3, height: 1.2, label: 'Bare-root tree' },
}

/** The size at planting when none is given, by layer (from memory); a sown area starts from seed. */
export function defaultStart(layer: Layer, sown = false): StartSize {
  if (sown) return 'seed'
  return layer === 'ground' ? 'plug' : layer === 'shrub' ? 'pot' : 'bare-root'
}

/** The moments the editor's time control offers: at planting, years 1, 3, 5, and maturity (null). */
export const GROWTH_STEPS: Array<{ years: number | null; label: string }> = [
  { years: 0, label: 'At planting' }, { years: 1, label: 'Year 1' }, { years: 3, label: 'Year 3' }, { years: 5, label: 'Year 5' }, { years: null, label: 'At maturity' },
]

export interface Growth {
  /** fraction of the way from planting size to mature size, 0–1 */
  fraction: number
  spread: number
  height: number
  years: number
  /** the rate was assumed (USDA gives none) */
  estimated: boolean
}

/**
 * The size of a planting `years` after planting (null: at maturity). Linear from planting size to mature
 * size over the years to maturity (a plain straight line; common practice for planning, not a growth curve).
 */
export function grownSize(p: Pick<YardPlanting, 'start' | 'startSpread' | 'spacing' | 'points'>, layer: Layer, rate: GrowthRate | null | undefined, mature: { spread: number; height: number }, years: number | null): Growth {
  const yearsToMature = YEARS_TO_MATURITY[layer][rate ?? DEFAULT_RATE]
  const estimated = !rate
  if (years === null) return { fraction: 1, spread: mature.spread, height: mature.height, years: yearsToMature, estimated }
  const start = START_SIZE[p.start ?? defaultStart(layer, Array.isArray(p.points) && p.spacing === null)]
  const s0 = Math.min(p.startSpread ?? start.spread, mature.spread)
  const h0 = Math.min(start.height, mature.height)
  const fraction = Math.max(0, Math.min(1, years / yearsToMature))
  return { fraction, spread: s0 + (mature.spread - s0) * fraction, height: h0 + (mature.height - h0) * fraction, years: yearsToMature, estimated }
}
