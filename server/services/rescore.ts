// Re-scoring a yard after an edit, doing only the work the edit calls for. A score keeps what it was made from
// (a ScoreState); the next score starts from it. Moving, resizing, adding or re-naming point plantings (most
// edits to a big yard) re-measures just those plantings and re-sums only their blocks of the tally, so the cost
// does not grow with the yard. Any other edit (areas, outlines, the lot, removals) re-measures through the memo,
// which still reuses every planting whose inputs did not change. Both give exactly what a fresh score gives.
import { isAreaPlanting, type YardDocument, type YardPlanting } from '#shared/schemas/yard-document'
import type { Score, ScoredPlanting, ScoreWarning } from '#shared/schemas/score'
import type { SpeciesFacts } from '#shared/types/species'
import type { ElementLocator, YardChanges } from '#shared/utils/yard-changes'
import { regionName } from '#shared/utils/regions'
import {
  assembleScore, canonicalFacts, factsAndGoal, factsKey, layerBySize, lineOf, measurePlanting, newMeasureMemo, sameFacts,
  scoreParts, speciesKeys, tallyBlock, TALLY_BLOCK, type MeasureMemo, type ScoreParts,
} from './scoring'

export interface ScoreState extends ScoreParts {
  memo: MeasureMemo
  /** each planting's own warnings, by index (the parts' `warnings` are these after the region's) */
  own: ScoreWarning[][]
  head: ScoreWarning[]
  /** the species named in the document, lower-cased, and the facts each had (absent: not in the catalogue) */
  keys: Set<string>
  facts: Map<string, SpeciesFacts>
  /** planting id → index; shared along a chain of edits, so an entry is checked before it is trusted */
  ids: Map<string, number>
}

function stateOf(doc: YardDocument, facts: Map<string, SpeciesFacts>, memo: MeasureMemo, keys: Set<string>, ids?: Map<string, number>): ScoreState {
  const parts = scoreParts(doc, facts, null, memo)
  const own = parts.remembered!.map((r) => r!.warnings)
  const head = parts.warnings.slice(0, parts.warnings.length - own.reduce((n, w) => n + w.length, 0))
  return { ...parts, memo, own, head, keys, facts: canonicalFacts(facts, memo), ids: ids ?? new Map(doc.plantings.map((p, i) => [p.id, i])) }
}

/** The state of a fresh score of a whole document (facts keyed by lower-cased name). */
export function freshState(doc: YardDocument, facts: Map<string, SpeciesFacts>): ScoreState {
  return stateOf(doc, facts, newMeasureMemo(), speciesKeys(doc))
}

/** A fresh score of a whole document, and the state to re-score its edits from. */
export async function scoreWithState(doc: YardDocument): Promise<{ score: Score; state: ScoreState }> {
  const { facts, goal } = await factsAndGoal(speciesKeys(doc), doc.region ?? null)
  const state = freshState(doc, facts)
  return { score: assembleScore(state, goal), state }
}

const sameWarnings = (a: ScoreWarning[], b: ScoreWarning[]) => a.length === b.length && a.every((w, i) => w.id === b[i]!.id && w.message === b[i]!.message)

/** Where a planting id sits in `doc`, using the shared index when it is right. */
export function plantingIndex(state: Pick<ScoreState, 'ids'>, doc: YardDocument, id: string): number | undefined {
  const i = state.ids.get(id)
  if (i === undefined) return undefined
  if (doc.plantings[i]?.id === id) return i
  const found = doc.plantings.findIndex((p) => p.id === id)
  return found < 0 ? undefined : found
}

// only point plantings changed or were added, and nothing they are measured against
function pointsOnly(state: ScoreState, doc: YardDocument, changes: YardChanges): boolean {
  return !changes.fields && !changes.areas && !changes.plantings?.remove?.length && doc.areas === state.doc.areas
    && doc.boundary === state.doc.boundary && (doc.region ?? null) === state.region && (changes.plantings?.upsert ?? []).every((p) => !isAreaPlanting(p))
}

/** The species whose facts the next state needs. */
export function keysFor(state: ScoreState, doc: YardDocument, changes: YardChanges): Set<string> {
  if (!pointsOnly(state, doc, changes)) return speciesKeys(doc)
  const keys = new Set(state.keys)
  for (const p of changes.plantings?.upsert ?? []) if (p.species) keys.add(factsKey(p.species))
  return keys
}

/** Where an element of the state's document sits, for applyYardChanges: plantings by the shared index, areas by a scan. */
export function elementLocator(state: ScoreState): ElementLocator {
  return (list, id) => {
    if (list === 'plantings') return plantingIndex(state, state.doc, id)
    const i = state.doc.areas.findIndex((a) => a.id === id)
    return i < 0 ? undefined : i
  }
}

/**
 * The state for `doc` (the state's document with `changes` applied), given facts for `keysFor(…)`; `changed`
 * lists the answer lines that differ from the state's, `quick` says whether only the changed plantings were redone.
 */
export function nextState(state: ScoreState, doc: YardDocument, changes: YardChanges, facts: Map<string, SpeciesFacts>, keys = keysFor(state, doc, changes)) {
  const quick = pointsOnly(state, doc, changes) ? rescorePoints(state, doc, changes.plantings?.upsert ?? [], facts, keys) : null
  if (quick) return { state: quick.state, changed: quick.changed, removed: [] as string[], quick: true }
  // the id index stays right while nothing is removed (kept plantings keep their places, new ones go last)
  const keepIds = !changes.plantings?.remove?.length
  const next = stateOf(doc, facts, state.memo, keys, keepIds ? state.ids : undefined)
  if (keepIds) for (let i = state.doc.plantings.length; i < doc.plantings.length; i++) next.ids.set(doc.plantings[i]!.id, i)
  return { state: next, ...changedLines(state.lines, next.lines), quick: false }
}

/** The score of `doc` (the state's document with `changes` applied), and what changed since the state's. */
export async function rescore(state: ScoreState, doc: YardDocument, changes: YardChanges) {
  const keys = keysFor(state, doc, changes)
  const { facts, goal } = await factsAndGoal(keys, doc.region ?? null)
  const next = nextState(state, doc, changes, facts, keys)
  return { ...next, score: assembleScore(next.state, goal) }
}

const sameLine = (a: ScoredPlanting, b: ScoredPlanting) => a === b
  || (a.status === b.status && a.layer === b.layer && a.count === b.count && a.area === b.area && a.volume === b.volume && a.cultivar === b.cultivar)

/** Lines of `now` that are new or differ from `before`, and ids in `before` that `now` no longer has. */
export function changedLines(before: ScoredPlanting[], now: ScoredPlanting[]): { changed: ScoredPlanting[]; removed: string[] } {
  const changed: ScoredPlanting[] = []
  // most edits keep every line in its place; a lookup by id is built only once the lists stop lining up
  let byId: Map<string, ScoredPlanting> | null = null
  for (let i = 0; i < now.length; i++) {
    const line = now[i]!
    let was: ScoredPlanting | undefined = before[i]
    if (was?.id !== line.id) was = (byId ??= new Map(before.map((l) => [l.id, l]))).get(line.id)
    if (!was || !sameLine(was, line)) changed.push(line)
  }
  if (!byId && before.length === now.length) return { changed, removed: [] }
  const ids = new Set(now.map((l) => l.id))
  return { changed, removed: before.filter((l) => !ids.has(l.id)).map((l) => l.id) }
}

/** Only point plantings changed or were added: re-measure those, re-sum their blocks. Null when it does not apply. */
function rescorePoints(state: ScoreState, doc: YardDocument, upserts: YardPlanting[], fresh: Map<string, SpeciesFacts>, keys: Set<string>): { state: ScoreState; changed: ScoredPlanting[] } | null {
  // every species the yard names must still have the facts it was scored with (the catalogue can change)
  for (const key of state.keys) if (!sameFacts(state.facts.get(key), fresh.get(key))) return null
  const facts = canonicalFacts(fresh, state.memo)
  const n = state.measures.length
  const measures = state.measures.slice()
  const lines = state.lines.slice()
  const own = state.own.slice()
  const blocks = state.blocks.slice()
  let invasive = state.invasive
  let warningsMoved = false
  const touched = new Set<number>()
  const changed: ScoredPlanting[] = []
  const ctx = { lot: state.lot, region: state.region, where: state.region ? regionName(state.region) : 'this region' }
  let appended = n
  for (const p of upserts) {
    const at = plantingIndex(state, state.doc, p.id)
    const i = at ?? appended++
    // a planting that was an outline is part of the ground layer's cutting: not a point-only change
    if (doc.plantings[i] !== p || (at !== undefined && state.measures[at]!.isArea)) return null
    const key = p.species ? factsKey(p.species) : null
    const f = key ? facts.get(key) : undefined
    const warnings: ScoreWarning[] = []
    const m = measurePlanting(p, i, f, f?.layer ?? layerBySize(p), ctx, warnings)
    const remembered = { key, facts: f, lot: state.lot, region: state.region, above: undefined, measure: m, warnings }
    state.memo.plantings.set(p, remembered)
    const line = lineOf(m, remembered)
    const old = at === undefined ? undefined : state.measures[at]
    if (!old || !sameLine(state.lines[at!]!, line)) changed.push(line)
    if (!sameWarnings(state.own[i] ?? [], warnings)) warningsMoved = true
    measures[i] = m
    lines[i] = line
    own[i] = warnings
    touched.add(Math.floor(i / TALLY_BLOCK))
    if (old?.status === 'invasive' || m.status === 'invasive') {
      // kept in planting order, as a fresh tally lists them
      invasive = invasive.filter((x) => x.index !== i)
      if (m.status === 'invasive') {
        const after = invasive.findIndex((x) => x.index > i)
        invasive.splice(after < 0 ? invasive.length : after, 0, m)
      }
    }
    if (at === undefined) state.ids.set(p.id, i)
  }
  if (appended !== doc.plantings.length) return null
  for (const b of touched) blocks[b] = tallyBlock(measures, b)
  const warnings = warningsMoved ? [...state.head, ...own.flat()] : state.warnings
  return { state: { ...state, doc, measures, lines, own, blocks, invasive, warnings, keys, facts }, changed }
}
