// The native-share engine: a pure function of (document, species facts, goal). The server scores saved and
// posted yards with it (server/services/scoring.ts loads the facts and the goal); the editor runs the same
// code in the browser on every edit (app/composables/useYardScore.ts), with a memo so that only what changed
// is measured again.
import type { YardDocument } from '../../schemas/yard-document'
import type { SpeciesFacts } from '../../types/species'
import type { Score, ScoredPlanting, Shares, ShareKind, Totals } from '../../schemas/score'
import { round3, STATUSES, tallyYard } from './tally'
import { measureYard, type MeasuredYard, type PlantingMeasure } from './measure'
import { movesToGoal } from './moves'
import type { ScoreMemo } from './memo'

export { createScoreMemo, type ScoreMemo } from './memo'
export { DEFAULT_GOAL, GOAL_MAX, GOAL_MIN, GOAL_TOLERANCE, meetsGoal } from './goal'
export { round3, contribution, tallyYard, type YardTally } from './tally'
export { speciesKeys, measureYard, TYPICAL_SIZE, MOWN_LAWN_HEIGHT, type MeasuredYard, type PlantingMeasure } from './measure'

const SHARE_FIELDS: ShareKind[] = ['count', 'area', 'volume']

/** The three shares from native and total sums (rounded sums, exact share). */
export function sharesOf(native: Totals, total: Totals): Shares {
  const out = {} as Shares
  for (const s of SHARE_FIELDS) out[s] = { native: round3(native[s]), total: round3(total[s]), share: total[s] > 0 ? native[s] / total[s] : null }
  return out
}

const lineOf = (p: PlantingMeasure): ScoredPlanting => ({ id: p.id, status: p.status, layer: p.layer, count: p.count, area: round3(p.area), volume: round3(p.volume), cultivar: p.cultivar })

/** The score of a measured yard against `goal`. */
export function scoreMeasured(measured: MeasuredYard, goal: number, memo?: ScoreMemo): Score {
  const tally = tallyYard(measured.plantings)
  const byStatus = {} as Score['byStatus']
  for (const s of STATUSES) { const t = tally.byStatus[s]; byStatus[s] = { count: t.count, area: round3(t.area), volume: round3(t.volume) } }
  const { moves, warnings: moveWarnings } = movesToGoal(measured, goal, tally, memo)
  return {
    goal,
    shares: sharesOf(tally.native, tally.total),
    byStatus,
    straightSpecies: sharesOf(tally.straight, tally.total),
    plantings: measured.plantings.map(lineOf),
    moves,
    warnings: moveWarnings.length ? [...measured.warnings, ...moveWarnings] : measured.warnings,
  }
}

/**
 * The score of a yard document: species facts keyed by `nameKey` (shared/utils/species-name.ts), the goal share, the region (default: the
 * document's). The memo, when given, carries what the last call worked out (the editor's; the server passes none).
 */
export function scoreYard(doc: YardDocument, facts: Map<string, SpeciesFacts>, goal: number, region?: string | null, memo?: ScoreMemo): Score {
  return scoreMeasured(measureYard(doc, facts, region, memo), goal, memo)
}
