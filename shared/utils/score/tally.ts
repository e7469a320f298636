// Sums over a measured yard, per status and for the shares; the invasive and lawn plantings the moves work on.
import type { PlantingStatus } from '../../types/species'
import type { ShareKind, Totals } from '../../schemas/score'
import type { PlantingMeasure } from './measure'

export const round3 = (x: number) => Math.round(x * 1000) / 1000

export const STATUSES: PlantingStatus[] = ['native', 'introduced', 'invasive', 'nativeAndIntroduced', 'unknown']

export function contribution(p: PlantingMeasure, share: ShareKind): number {
  return share === 'count' ? (p.count ?? 0) : share === 'area' ? p.area : p.volume
}

/** Sums over a measured yard: per status, native, straight-species native, and total. */
export interface YardTally {
  byStatus: Record<PlantingStatus, Totals>
  native: Totals
  straight: Totals
  total: Totals
  /** the plantings the moves look at: invasive ones, and lawn */
  invasive: PlantingMeasure[]
  lawn: PlantingMeasure[]
}

const zero = (): Totals => ({ count: 0, area: 0, volume: 0 })

export function tallyYard(plantings: PlantingMeasure[]): YardTally {
  const byStatus = {} as Record<PlantingStatus, Totals>
  for (const s of STATUSES) byStatus[s] = zero()
  const straight = zero()
  const invasive: PlantingMeasure[] = []
  const lawn: PlantingMeasure[] = []
  for (const p of plantings) {
    const t = byStatus[p.status]
    const count = p.count ?? 0
    t.count += count; t.area += p.area; t.volume += p.volume
    if (p.status === 'native' && !p.cultivar) { straight.count += count; straight.area += p.area; straight.volume += p.volume }
    if (p.status === 'invasive') invasive.push(p)
    if (p.lawn && p.isArea) lawn.push(p)
  }
  const total = zero()
  for (const s of STATUSES) { total.count += byStatus[s].count; total.area += byStatus[s].area; total.volume += byStatus[s].volume }
  return { byStatus, native: byStatus.native, straight, total, invasive, lawn }
}

