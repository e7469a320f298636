// The work a worker thread does for the server (server/services/score-pool.ts): checking a document-sized body,
// and the score engine's tasks; or the server itself where no worker file was built (development). Pure:
// everything comes in with the task.
import type { YardDocument } from '../../shared/schemas/yard-document'
import type { Score } from '../../shared/schemas/score'
import type { ShareSet } from '../../shared/schemas/advice'
import type { SpeciesFacts } from '../../shared/types/species'
import { measureYard, scoreYard, sharesOf, tallyYard } from '../../shared/utils/score'
import { yardDocument } from '../../shared/schemas/yard-document'
import { createYardBody, updateYardBody } from '../../shared/schemas/yard'
import { checkJsonBody, type BodyCheck } from '../utils/json-body'

/** The schemas of document-sized bodies, by name (a task names its schema: functions do not cross threads). */
export const BODY_SCHEMAS = { yardDocument, createYardBody, updateYardBody }
export type BodySchemaName = keyof typeof BODY_SCHEMAS

export type ScoreTask =
  | { kind: 'score'; doc: YardDocument; facts: Map<string, SpeciesFacts>; goal: number; region: string | null }
  | { kind: 'shares'; doc: YardDocument; facts: Map<string, SpeciesFacts>; region: string }
  | { kind: 'body'; schema: BodySchemaName; raw: string | undefined }

export interface YardShares { shares: ShareSet; lawnArea: number }

export function runScoreTask(task: ScoreTask & { kind: 'score' }): Score
export function runScoreTask(task: ScoreTask & { kind: 'shares' }): YardShares
export function runScoreTask(task: ScoreTask & { kind: 'body' }): BodyCheck<unknown>
export function runScoreTask(task: ScoreTask): Score | YardShares | BodyCheck<unknown>
export function runScoreTask(task: ScoreTask): Score | YardShares | BodyCheck<unknown> {
  if (task.kind === 'body') return checkJsonBody(BODY_SCHEMAS[task.schema], task.raw)
  if (task.kind === 'score') return scoreYard(task.doc, task.facts, task.goal, task.region)
  // the shares kept on a pledge, and the visible lawn area (m²)
  const measured = measureYard(task.doc, task.facts, task.region)
  const lawnArea = measured.plantings.filter((p) => p.lawn).reduce((s, p) => s + p.area, 0)
  const tally = tallyYard(measured.plantings)
  return { shares: sharesOf(tally.native, tally.total), lawnArea }
}
