// The native-share engine: a pure function of (document, species facts, goal). The server scores saved and
// posted yards with it (server/services/scoring.ts loads the facts and the goal); the editor runs the same
// code in the browser on every edit (app/composables/useYardScore.ts), with a memo so that only what changed
// is measured again.
import { phaseOf, type YardDocument } from '../../schemas/yard-document'
import type { SpeciesFacts } from '../../types/species'
import type { Score, ScoredPlanting, Shares, ShareKind, Totals } from '../../schemas/score'
import { round3, STATUSES, tallyYard } from './tally'
import { measureYard, type MeasuredYard, type PlantingMeasure } from './measure'
import { movesToGoal } from './moves'
import { hasPlan, phaseView } from './phases'
import { createScoreMemo, type ScoreMemo } from './memo'
import { nameKey } from '../species-name'

export { YEARS_TO_MATURITY, START_SIZE, GROWTH_STEPS, DEFAULT_RATE, defaultStart, grownSize } from './growth'
export { createScoreMemo, type ScoreMemo } from './memo'
export { movesAsPlanItems } from './plan-items'
export { phaseView, hasPlan } from './phases'
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


/** The shares of the yard as it is now (there now + to remove): what a pledge is judged on. */
export function sharesNow(doc: YardDocument, facts: Map<string, SpeciesFacts>, region?: string | null, memo?: ScoreMemo): { shares: Shares; measured: MeasuredYard } {
  const measured = measureYard(phaseView(doc, 'now'), facts, region, memo)
  const tally = tallyYard(measured.plantings)
  return { shares: sharesOf(tally.native, tally.total), measured }
}

/**
 * Plants to raise per species (key: the trimmed lower-cased name): the counts of plantings still to plant, and
 * for drifts to plant the plants their visible, lot-clipped area needs (the area the score counts).
 */
export function plantsToPlant(doc: YardDocument, facts: Map<string, SpeciesFacts>, region?: string | null): Map<string, { name: string; plants: number; cultivars: boolean }> {
  const out = new Map<string, { name: string; plants: number; cultivars: boolean }>()
  const planned = phaseView(doc, 'planned')
  const measured = measureYard(planned, facts, region)
  for (const m of measured.plantings) {
    const p = planned.plantings[m.index]!
    if (phaseOf(p) !== 'planned' || !p.species) continue
    const key = nameKey(p.species)
    const entry = out.get(key) ?? { name: p.species.trim(), plants: 0, cultivars: false }
    entry.plants += m.count ?? 0
    if (p.cultivar) entry.cultivars = true
    out.set(key, entry)
  }
  return out
}

/** The score of a measured yard against `goal` (the plan's; `now` when the yard has a plan, else the same). */
export function scoreMeasured(measured: MeasuredYard, goal: number, memo?: ScoreMemo, nowMeasured?: MeasuredYard, years: number | null = null): Score {
  const tally = tallyYard(measured.plantings)
  const byStatus = {} as Score['byStatus']
  for (const s of STATUSES) { const t = tally.byStatus[s]; byStatus[s] = { count: t.count, area: round3(t.area), volume: round3(t.volume) } }
  const { moves, warnings: moveWarnings } = movesToGoal(measured, goal, tally, memo)
  const planned = sharesOf(tally.native, tally.total)
  const nowTally = nowMeasured ? tallyYard(nowMeasured.plantings) : null
  const lines = measured.plantings.map(lineOf)
  // plantings to remove are not in the plan: their lines come from the yard as it is now
  if (nowMeasured) for (const p of nowMeasured.plantings) if (phaseOf(nowMeasured.doc.plantings[p.index]!) === 'removing') lines.push(lineOf(p))
  return {
    goal,
    shares: planned,
    now: nowTally ? sharesOf(nowTally.native, nowTally.total) : planned,
    planned,
    years,
    byStatus,
    straightSpecies: sharesOf(tally.straight, tally.total),
    plantings: lines,
    moves,
    warnings: moveWarnings.length ? [...measured.warnings, ...moveWarnings] : measured.warnings,
  }
}

/**
 * The score of a yard document: species facts keyed by `nameKey` (shared/utils/species-name.ts), the goal share, the region (default: the
 * document's). The memo, when given, carries what the last call worked out (the editor's; the server passes none).
 */
export function scoreYard(doc: YardDocument, facts: Map<string, SpeciesFacts>, goal: number, region?: string | null, memo?: ScoreMemo, options: { years?: number | null } = {}): Score {
  const years = options.years ?? null
  if (!hasPlan(doc)) return scoreMeasured(measureYard(doc, facts, region, memo, years), goal, memo, undefined, years)
  const planned = measureYard(phaseView(doc, 'planned'), facts, region, memo, years)
  const now = measureYard(phaseView(doc, 'now'), facts, region, memo && (memo.now ??= createScoreMemo()))
  return scoreMeasured(planned, goal, memo, now, years)
}
