// What the editor keeps between scores of the yard it edits: per planting object, the measure worked out for
// it and everything that measure depended on. Plain data passed in by the caller; the engine keeps nothing.
import type { YardPlanting } from '../../schemas/yard-document'
import type { ScoreWarning } from '../../schemas/score'
import type { SpeciesFacts } from '../../types/species'
import type { Ring } from '../polygon'
import type { Cutter, Shape } from '../geometry'
import type { PlantingMeasure } from './measure'

export interface Remembered {
  /** the planting's fields as a string when it was measured */
  key: string
  facts: SpeciesFacts | undefined
  lot: Shape | null
  region: string | null
  above: Cutter[] | undefined
  measure: PlantingMeasure
  warnings: ScoreWarning[]
}

export interface ScoreMemo {
  plantings: WeakMap<YardPlanting, Remembered>
  /** prepared outlines, by outline array, with the coordinates they were prepared from */
  shapes: WeakMap<Ring, { key: string; shape: Shape }>
  /** ground-layer clumps' cutting discs, by planting, with the place and radius they were drawn for */
  discs: WeakMap<YardPlanting, { key: string; shape: Shape }>
  /** one object per species while its facts stay equal, so a planting's facts compare by identity */
  facts: Map<string, SpeciesFacts>
  /** the lot's roomiest point (for add-plants moves), by lot shape */
  roomiest: WeakMap<Shape, { point: [number, number]; clearance: number }>
  /** the yard as it is now is measured with its own memo (its plantings sit under other shapes than in the plan) */
  now?: ScoreMemo
}

/** A fresh memo: one per yard being edited. */
export const createScoreMemo = (): ScoreMemo => ({ plantings: new WeakMap(), shapes: new WeakMap(), discs: new WeakMap(), facts: new Map(), roomiest: new WeakMap() })

export function sameFacts(a: SpeciesFacts | undefined, b: SpeciesFacts | undefined): boolean {
  if (a === b) return true
  if (!a || !b) return false
  return a.status === b.status && a.layer === b.layer && a.spread === b.spread && a.height === b.height && a.spacing === b.spacing
    && a.lawn === b.lawn && (a.growthRate ?? null) === (b.growthRate ?? null) && a.scientificName === b.scientificName && a.commonName === b.commonName && a.estimated.join() === b.estimated.join()
}
