// The score engine's work as tasks a worker thread can run (server/services/score-pool.ts), or the server
// itself where no worker file was built (development). Pure: everything comes in with the task.
import type { YardDocument } from '../../shared/schemas/yard-document'
import type { Score } from '../../shared/schemas/score'
import type { ShareSet } from '../../shared/schemas/advice'
import type { SpeciesFacts } from '../../shared/types/species'
import { measureYard, scoreYard, sharesOf, tallyYard } from '../../shared/utils/score'

export type ScoreTask =
  | { kind: 'score'; doc: YardDocument; facts: Map<string, SpeciesFacts>; goal: number; region: string | null }
  | { kind: 'shares'; doc: YardDocument; facts: Map<string, SpeciesFacts>; region: string }

export interface YardShares { shares: ShareSet; lawnArea: number }

export function runScoreTask(task: ScoreTask & { kind: 'score' }): Score
export function runScoreTask(task: ScoreTask & { kind: 'shares' }): YardShares
export function runScoreTask(task: ScoreTask): Score | YardShares
export function runScoreTask(task: ScoreTask): Score | YardShares {
  if (task.kind === 'score') return scoreYard(task.doc, task.facts, task.goal, task.region)
  // the shares kept on a pledge, and the visible lawn area (m²)
  const measured = measureYard(task.doc, task.facts, task.region)
  const lawnArea = measured.plantings.filter((p) => p.lawn).reduce((s, p) => s + p.area, 0)
  const tally = tallyYard(measured.plantings)
  return { shares: sharesOf(tally.native, tally.total), lawnArea }
}
