// Our own palette for the plan: status colours for plantings, materials for areas. Invasive plantings also get
// a hatch and a heavy dashed outline, so they stand out without colour.
import type { PlantingStatusName } from '~/stores/editor'
import { statusLabel } from '#shared/utils/species-status'

export interface StatusStyle { fill: string; stroke: string; label: string; dash: number[]; hatch: boolean; strokeWidth: number }

export const STATUS_STYLES: Record<PlantingStatusName, StatusStyle> = {
  native: { fill: '#4f9a62', stroke: '#1f5a33', label: statusLabel('native'), dash: [], hatch: false, strokeWidth: 1.5 },
  introduced: { fill: '#e0a528', stroke: '#8a5d00', label: statusLabel('introduced'), dash: [], hatch: false, strokeWidth: 1.5 },
  invasive: { fill: '#c2452d', stroke: '#4a1208', label: statusLabel('invasive'), dash: [6, 3], hatch: true, strokeWidth: 3 },
  nativeAndIntroduced: { fill: '#7d8fc4', stroke: '#2f3f73', label: statusLabel('nativeAndIntroduced'), dash: [2, 2], hatch: false, strokeWidth: 1.5 },
  unknown: { fill: '#a39c8c', stroke: '#4f4a3e', label: 'Unidentified', dash: [4, 4], hatch: false, strokeWidth: 1.5 },
}

export interface AreaStyle { fill: string; stroke: string; label: string; dash: number[] }

export const AREA_STYLES: Record<'lot' | 'building' | 'paving' | 'bed' | 'water', AreaStyle> = {
  lot: { fill: '#fbfaf4', stroke: '#5a5446', label: 'Lot', dash: [10, 5] },
  building: { fill: '#b9b09d', stroke: '#4d473b', label: 'Building', dash: [] },
  paving: { fill: '#dcd7cb', stroke: '#8a826f', label: 'Paving', dash: [] },
  bed: { fill: '#e6cfac', stroke: '#8b6a43', label: 'Bed', dash: [] },
  water: { fill: '#a6d2e6', stroke: '#3b7a9c', label: 'Water', dash: [] },
}

export const LAWN_FILL = '#d7e6b9'

/** How the plan marks the phases (there now is drawn plain): plan ink for what is to plant, a strike for what is to go. */
export const PHASE_STYLES: Record<'planned' | 'removing', { stroke: string; dash: number[]; width: number; swatch: string }> = {
  planned: { stroke: '#1b6f86', dash: [2, 4], width: 2.5, swatch: 'repeating-linear-gradient(90deg, #1b6f86 0 2px, transparent 2px 5px)' },
  removing: { stroke: '#7a2a1c', dash: [9, 3, 2, 3], width: 2, swatch: 'linear-gradient(135deg, transparent 45%, #7a2a1c 45% 55%, transparent 55%)' },
}

export const LINE_STYLES = {
  overhead: { stroke: '#3d3d52', dash: [10, 4, 2, 4], label: 'Overhead line' },
  buried: { stroke: '#c05f00', dash: [3, 4], label: 'Buried line' },
} as const

/** A planting's display name: common name, else the species, else "Unidentified plant". */
export function plantingName(p: { species: string | null; cultivar?: string | null; label?: string }, common?: string | null): string {
  if (p.label) return p.label
  const base = common || p.species || 'Unidentified plant'
  return p.cultivar ? `${base} ‘${p.cultivar}’` : base
}

/** "Quercus alba" → "Q. alba", for small labels on the plan. */
export function shortSpecies(name: string | null): string {
  if (!name) return '?'
  const [genus, ...rest] = name.split(' ')
  return rest.length ? `${genus![0]}. ${rest.join(' ')}` : genus!
}
