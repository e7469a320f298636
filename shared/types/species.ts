// Species facts as the app uses them, whatever the catalogue stores underneath.
export const LAYERS = ['tree', 'shrub', 'ground'] as const
export type Layer = (typeof LAYERS)[number]

/** A species' status in one region (state or province). */
export const REGION_STATUSES = ['native', 'introduced', 'invasive', 'nativeAndIntroduced', 'absent'] as const
export type RegionStatus = (typeof REGION_STATUSES)[number]

/** A planting's status for scoring: the region status, or unknown when no species (or an unlisted one) is given. */
export type PlantingStatus = 'native' | 'introduced' | 'invasive' | 'nativeAndIntroduced' | 'unknown'

export interface SpeciesFacts {
  scientificName: string
  commonName: string | null
  layer: Layer
  status: RegionStatus
  /** mature spread and height in metres, and a typical on-centre spacing for drifts (null: sown or sodded) */
  spread: number
  height: number
  spacing: number | null
  /** true for turf grasses: an area of it is lawn */
  lawn: boolean
  /** which of spread/height/spacing are defaults rather than data */
  estimated: Array<'spread' | 'height' | 'spacing'>
  toxic: boolean
}

export type Sun = 'full' | 'part' | 'shade'
export type Moisture = 'dry' | 'medium' | 'wet'
export type Soil = 'sand' | 'loam' | 'clay'

/**
 * Everything the catalogue knows of a species in one region, for species pages, fits and the seed plan.
 * `sources` names where each fact came from ("USDA PLANTS", "coordinator", "from memory", "estimated: …").
 */
export interface SpeciesDetails extends SpeciesFacts {
  family: string | null
  growthHabit: string | null
  bloomMonths: number[]
  /** coldest USDA hardiness zone it survives, e.g. "4a" */
  minZone: string | null
  sun: Sun[]
  moisture: Moisture[]
  soil: Soil[]
  toxicity: string | null
  propagatedBySeed: boolean | null
  coldStratification: boolean | null
  coldMoistDays: number | null
  seedNeedsLight: boolean | null
  scarify: boolean
  hotWaterSoak: boolean
  /** seed that dies when dried: sown in fall as soon as collected (the catalogue's flag or its default list) */
  sowFresh?: boolean
  seedsPerPound: number | null
  seedlingsPerPot: number | null
  commercialAvailability: string | null
  /** plain words: "host plant for caterpillars", "seed for birds", "nectar" … */
  wildlife: string[]
  sources: Record<string, string>
  /** every field whose value is a default rather than data (a superset of `estimated`) */
  estimatedFields?: string[]
  /** regions whose 2015 state (or the federal) noxious list names it */
  noxiousIn?: string[]
  notes?: string | null
  usdaSymbol?: string | null
  origin?: 'usda' | 'coordinator'
  /** true when USDA PLANTS has a characteristics row (sun, soil, bloom, zone …) */
  hasFacts?: boolean
  /** false for inconspicuous (wind-pollinated) flowers, which fill no bloom gap */
  flowerConspicuous?: boolean | null
  duration?: string | null
}
