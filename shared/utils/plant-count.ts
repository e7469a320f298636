// Plants needed to fill an area at an on-centre spacing. Square layout: one plant per s²; triangular
// (staggered rows, each plant equidistant from six others): one per (√3/2)·s² ≈ 0.866 s², i.e. square ÷ 0.866.
export type PlantLayout = 'square' | 'triangular'

export const TRIANGULAR_FACTOR = Math.sqrt(3) / 2

/** Plants per area, unrounded. */
export function plantsPerArea(areaM2: number, spacingM: number, layout: PlantLayout = 'triangular'): number {
  if (!(spacingM > 0) || !(areaM2 > 0)) return 0
  return areaM2 / (spacingM * spacingM * (layout === 'triangular' ? TRIANGULAR_FACTOR : 1))
}

/** Whole plants to buy or grow: rounded up, ignoring floating-point dust just above a whole number. */
export function plantsNeeded(areaM2: number, spacingM: number, layout: PlantLayout = 'triangular'): number {
  const n = plantsPerArea(areaM2, spacingM, layout)
  return n === 0 ? 0 : Math.ceil(n - 1e-9)
}

/** Area that `plants` plants fill at a spacing (the inverse, for moves that add a drift of k plants). */
export function areaForPlants(plants: number, spacingM: number, layout: PlantLayout = 'triangular'): number {
  return plants * spacingM * spacingM * (layout === 'triangular' ? TRIANGULAR_FACTOR : 1)
}
