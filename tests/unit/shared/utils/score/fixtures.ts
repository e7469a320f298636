// Species facts for score tests: test fixtures with invented sizes and statuses, not catalogue data.
import type { SpeciesFacts, RegionStatus, Layer } from '#shared/types/species'
import fc from 'fast-check'
import type { YardArea, YardDocument, YardPlanting } from '#shared/schemas/yard-document'

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

/** Random small yards over the fixture species (and an unidentified one), with a goal: for property tests. */
export function randomYards() {
  const species = ['Quercus alba', 'Acer platanoides', 'Cornus sericea', 'Berberis thunbergii', 'Lonicera maackii', 'Carex pensylvanica',
    'Echinacea purpurea', 'Hosta plantaginea', 'Celastrus orbiculatus', 'Poa pratensis', 'Yucca brevifolia', 'Plantago imaginaria', null]
  const size = fc.double({ min: 0.2, max: 12, noNaN: true })
  const box = (w: number, h: number) => fc.tuple(fc.double({ min: -2, max: w, noNaN: true }), fc.double({ min: -2, max: h, noNaN: true }), fc.double({ min: 0.5, max: 10, noNaN: true }), fc.double({ min: 0.5, max: 10, noNaN: true }))
    .map(([x, y, bw, bh]) => rect(x, y, bw, bh))
  return fc.record({ w: fc.integer({ min: 6, max: 40 }), h: fc.integer({ min: 6, max: 40 }), notch: fc.boolean(), lawn: fc.constantFrom('Poa pratensis', 'Festuca arundinacea', null), units: fc.constantFrom('m' as const, 'ft' as const) })
    .chain(({ w, h, notch, lawn, units }) => fc.record({
      areas: fc.array(fc.record({ kind: fc.constantFrom('building', 'paving', 'bed', 'water'), z: fc.integer({ min: 0, max: 9 }), points: box(w, h) }), { maxLength: 6 }),
      drifts: fc.array(fc.record({ species: fc.constantFrom(...species), z: fc.integer({ min: 0, max: 9 }), points: box(w, h), spacing: fc.option(fc.double({ min: 0.2, max: 1.5, noNaN: true }), { nil: undefined }), height: fc.option(size, { nil: undefined }) }), { maxLength: 5 }),
      plants: fc.array(fc.record({ species: fc.constantFrom(...species), x: fc.double({ min: -1, max: w + 1, noNaN: true }), y: fc.double({ min: -1, max: h + 1, noNaN: true }), count: fc.integer({ min: 1, max: 30 }), spread: fc.option(size, { nil: undefined }), height: fc.option(size, { nil: undefined }) }), { maxLength: 15 }),
      goal: fc.double({ min: 0.3, max: 0.95, noNaN: true }),
    }).map(({ areas, drifts, plants, goal }): { doc: YardDocument; goal: number } => {
      const boundary: [number, number][] = notch ? [[0, 0], [w, 0], [w, h / 2], [w / 2, h / 2], [w / 2, h], [0, h]] : rect(0, 0, w, h)
      const plantings: YardPlanting[] = [
        ...(lawn ? [{ id: 'lawn', species: lawn, z: 0, points: rect(0, 0, w, h), spacing: null, height: 0.08 }] : []),
        ...drifts.map((d, i) => ({ id: `d${i}`, ...d })),
        ...plants.map((p, i) => ({ id: `p${i}`, ...p })),
      ]
      return { doc: yard({ units, boundary, areas: areas.map((a, i): YardArea => ({ id: `a${i}`, ...a })), plantings }), goal }
    }))
}

export const EDIT_KINDS = ['move-plant', 'resize-plant', 'remove-plant', 'add-plant', 'add-drift', 'move-area', 'remove-area', 'species', 'region', 'boundary'] as const
export type Edit = { kind: (typeof EDIT_KINDS)[number]; at: number; d: number }

/** Random edits as the editor makes them (never reordering elements); apply with `applyEdit`. */
export const randomEdits = (maxLength = 6) => fc.array(fc.record({ kind: fc.constantFrom(...EDIT_KINDS), at: fc.nat(), d: fc.double({ min: -3, max: 3, noNaN: true }) }), { minLength: 1, maxLength })

const shift = (pts: [number, number][], d: number) => pts.map(([x, y]): [number, number] => [x + d, y - d / 2])

/** `doc` after one edit, as a new document that keeps every untouched element (like the editor's store). */
export function applyEdit(doc: YardDocument, e: Edit, serial: number): YardDocument {
  const plantings = doc.plantings.slice()
  const areas = doc.areas.slice()
  const pi = plantings.length ? e.at % plantings.length : -1
  const ai = areas.length ? e.at % areas.length : -1
  const p = plantings[pi]
  switch (e.kind) {
    case 'move-plant':
      if (p) plantings[pi] = p.points ? { ...p, points: shift(p.points, e.d) } : { ...p, x: p.x! + e.d, y: p.y! - e.d }
      break
    case 'resize-plant':
      if (p) plantings[pi] = p.points ? { ...p, spacing: p.spacing === null ? null : 0.2 + Math.abs(e.d) / 3 } : { ...p, count: 1 + (e.at % 7), spread: 0.2 + Math.abs(e.d) }
      break
    case 'remove-plant':
      if (p) plantings.splice(pi, 1)
      break
    case 'add-plant':
      plantings.push({ id: `new${serial}`, species: FIXTURE_FACTS[e.at % FIXTURE_FACTS.length]!.scientificName, x: 3 + e.d, y: 4 - e.d, count: 1 })
      break
    case 'add-drift':
      plantings.push({ id: `newd${serial}`, species: 'Carex pensylvanica', z: e.at % 9, points: rect(2 + e.d, 2, 3, 2), spacing: 0.3 })
      break
    case 'move-area':
      if (ai >= 0) areas[ai] = { ...areas[ai]!, points: shift(areas[ai]!.points, e.d) }
      break
    case 'remove-area':
      if (ai >= 0) areas.splice(ai, 1)
      break
    case 'species':
      if (p) plantings[pi] = { ...p, species: FIXTURE_FACTS[e.at % FIXTURE_FACTS.length]!.scientificName }
      break
    case 'region':
      return { ...doc, region: e.at % 2 ? 'US-OH' : 'CA-ON' }
    case 'boundary':
      return { ...doc, boundary: doc.boundary.map(([x, y]) => [x * (1 + Math.abs(e.d) / 10), y]) }
  }
  return { ...doc, plantings, areas }
}

/** The same edit made in place, as the editor's store makes it (the planting and outline objects are kept). */
export function mutateEdit(doc: YardDocument, e: Edit, serial: number): void {
  const pi = doc.plantings.length ? e.at % doc.plantings.length : -1
  const ai = doc.areas.length ? e.at % doc.areas.length : -1
  const p = doc.plantings[pi]
  const shiftInPlace = (pts: [number, number][], d: number) => { for (const pt of pts) { pt[0] += d; pt[1] -= d / 2 } }
  switch (e.kind) {
    case 'move-plant':
      if (p?.points) shiftInPlace(p.points as [number, number][], e.d)
      else if (p) { p.x = p.x! + e.d; p.y = p.y! - e.d }
      break
    case 'resize-plant':
      if (p?.points) { if (p.spacing !== null) p.spacing = 0.2 + Math.abs(e.d) / 3 } else if (p) { p.count = 1 + (e.at % 7); p.spread = 0.2 + Math.abs(e.d) }
      break
    case 'remove-plant':
      if (p) doc.plantings.splice(pi, 1)
      break
    case 'add-plant':
      doc.plantings.push({ id: `new${serial}`, species: FIXTURE_FACTS[e.at % FIXTURE_FACTS.length]!.scientificName, x: 3 + e.d, y: 4 - e.d, count: 1 })
      break
    case 'add-drift':
      doc.plantings.push({ id: `newd${serial}`, species: 'Carex pensylvanica', z: e.at % 9, points: rect(2 + e.d, 2, 3, 2), spacing: 0.3 })
      break
    case 'move-area':
      if (ai >= 0) shiftInPlace(doc.areas[ai]!.points as [number, number][], e.d)
      break
    case 'remove-area':
      if (ai >= 0) doc.areas.splice(ai, 1)
      break
    case 'species':
      if (p) p.species = FIXTURE_FACTS[e.at % FIXTURE_FACTS.length]!.scientificName
      break
    case 'region':
      doc.region = e.at % 2 ? 'US-OH' : 'CA-ON'
      break
    case 'boundary':
      for (const pt of doc.boundary) pt[0] *= 1 + Math.abs(e.d) / 10
      break
  }
}
