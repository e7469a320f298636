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
