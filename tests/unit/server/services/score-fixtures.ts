// Species facts for score tests: test fixtures with invented sizes and statuses, not catalogue data.
import type { SpeciesFacts, RegionStatus, Layer } from '#shared/types/species'
import type { YardDocument } from '#shared/schemas/yard-document'

function fact(scientificName: string, layer: Layer, status: RegionStatus, spread: number, height: number, spacing: number | null, lawn = false): SpeciesFacts {
  return { scientificName, commonName: null, layer, status, spread, height, spacing, lawn, estimated: [], toxic: false }
}

export const FIXTURE_FACTS: SpeciesFacts[] = [
  fact('Quercus alba', 'tree', 'native', 10, 20, null),
  fact('Acer platanoides', 'tree', 'introduced', 8, 15, null),
  fact('Cornus sericea', 'shrub', 'native', 2, 2, null),
  fact('Berberis thunbergii', 'shrub', 'invasive', 1.5, 1.5, null),
  fact('Lonicera maackii', 'shrub', 'invasive', 3, 4, null),
  fact('Carex pensylvanica', 'ground', 'native', 0.3, 0.2, 0.3),
  fact('Echinacea purpurea', 'ground', 'native', 0.5, 0.9, 0.45),
  fact('Hosta plantaginea', 'ground', 'introduced', 0.8, 0.5, 0.6),
  fact('Celastrus orbiculatus', 'ground', 'invasive', 1, 0.5, 1),
  fact('Poa pratensis', 'ground', 'nativeAndIntroduced', 0.1, 0.08, null, true),
  fact('Festuca arundinacea', 'ground', 'introduced', 0.1, 0.1, null, true),
  fact('Yucca brevifolia', 'shrub', 'absent', 3, 5, null),
]

export const facts = (list: SpeciesFacts[] = FIXTURE_FACTS) => new Map(list.map((f) => [f.scientificName.toLowerCase(), f]))

export const NATIVE_FOR = { tree: 'Quercus alba', shrub: 'Cornus sericea', ground: 'Carex pensylvanica' } as const

export const rect = (x: number, y: number, w: number, h: number): [number, number][] => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]

export function yard(partial: Partial<YardDocument>): YardDocument {
  return { format: 'wildward.yard/1', region: 'US-OH', units: 'm', boundary: rect(0, 0, 10, 10), areas: [], plantings: [], lines: [], ...partial }
}
