// Changes between two versions of a yard document, by element id: the editor sends these to re-score after an
// edit instead of the whole document (a 1,000-planting yard is ~120 KB; moving one plant changes ~100 bytes).
// `changesSince` (client) and `applyYardChanges` (server) are inverse: applying the changes to the earlier
// document gives the later one, element for element and in the same order.
import type { z } from 'zod'
import type { YardArea, YardDocument, YardPlanting, yardDocumentFields } from '../schemas/yard-document'
import type { Score, ScoreUpdate } from '../schemas/score'
import { MAX_AREAS, MAX_PLANTINGS, duplicateIdIssues, elementIssue, type ElementIssue } from '../schemas/yard-document'

export const CHANGE_FIELDS = ['name', 'region', 'zone', 'frost', 'units', 'boundary', 'lines', 'backdrop'] as const
type ChangeField = (typeof CHANGE_FIELDS)[number]

export interface ListChanges<T> {
  /** elements that are new (appended, in this order) or replace the element of the same id in place */
  upsert?: T[]
  remove?: string[]
}

export interface YardChanges {
  /** top-level fields given here replace the earlier ones; `null` clears an optional one */
  fields?: z.output<typeof yardDocumentFields>
  areas?: ListChanges<YardArea>
  plantings?: ListChanges<YardPlanting>
}

/** The document as last sent, element by element, to tell later what changed. */
export interface YardSnapshot {
  fields: Record<string, string>
  areas: Map<string, string>
  plantings: Map<string, string>
  areaOrder: string[]
  plantingOrder: string[]
}

const json = (v: unknown) => (v === undefined ? '' : JSON.stringify(v))

export function yardSnapshot(doc: Pick<YardDocument, ChangeField | 'areas' | 'plantings'>): YardSnapshot {
  const fields: Record<string, string> = {}
  for (const f of CHANGE_FIELDS) fields[f] = json(doc[f])
  return {
    fields,
    areas: new Map(doc.areas.map((a) => [a.id, json(a)])),
    plantings: new Map(doc.plantings.map((p) => [p.id, json(p)])),
    areaOrder: doc.areas.map((a) => a.id),
    plantingOrder: doc.plantings.map((p) => p.id),
  }
}

function listChanges<T extends { id: string }>(before: Map<string, string>, order: string[], items: T[], after: Map<string, string>): ListChanges<T> | null {
  const upsert: T[] = []
  const now = new Set<string>()
  const added: string[] = []
  for (const item of items) {
    now.add(item.id)
    const was = before.get(item.id)
    if (was === undefined) { upsert.push(item); added.push(item.id) } else if (was !== after.get(item.id)) upsert.push(item)
  }
  const remove = order.filter((id) => !now.has(id))
  // applying puts kept elements in their old order and new ones last; anything else (a reorder) needs the whole list
  const kept = order.filter((id) => now.has(id))
  const expected = [...kept, ...added]
  if (expected.length !== items.length || expected.some((id, i) => items[i]!.id !== id)) return null
  return upsert.length || remove.length ? { ...(upsert.length ? { upsert } : {}), ...(remove.length ? { remove } : {}) } : {}
}

/**
 * What changed from `snapshot` to `doc`, or null when the change is better sent as the whole document: elements
 * reordered, or so much changed that the changes would be most of the document anyway. `now` is `doc`'s own
 * snapshot, when the caller keeps it for the next edit (each element is serialised once).
 */
export function changesSince(snapshot: YardSnapshot, doc: Pick<YardDocument, ChangeField | 'areas' | 'plantings'>, now = yardSnapshot(doc)): YardChanges | null {
  const areas = listChanges(snapshot.areas, snapshot.areaOrder, doc.areas, now.areas)
  const plantings = areas && listChanges(snapshot.plantings, snapshot.plantingOrder, doc.plantings, now.plantings)
  if (!areas || !plantings) return null
  const touched = (areas.upsert?.length ?? 0) + (plantings.upsert?.length ?? 0)
  if (touched > 50 && touched > (doc.areas.length + doc.plantings.length) / 2) return null
  const fields: Record<string, unknown> = {}
  for (const f of CHANGE_FIELDS) {
    if (now.fields[f] !== snapshot.fields[f]) fields[f] = doc[f] === undefined ? null : doc[f]
  }
  const out: YardChanges = {}
  if (Object.keys(fields).length) out.fields = fields as YardChanges['fields']
  if (areas.upsert || areas.remove) out.areas = areas
  if (plantings.upsert || plantings.remove) out.plantings = plantings
  return out
}

/** Where an element id sits in a list of the base document, when the caller keeps an index (exact, or undefined). */
export type ElementLocator = (list: 'areas' | 'plantings', id: string) => number | undefined

const scanFor = <T extends { id: string }>(items: T[], id: string) => { const i = items.findIndex((item) => item.id === id); return i < 0 ? undefined : i }

function applyList<T extends YardArea | YardPlanting>(list: 'areas' | 'plantings', items: T[], change: ListChanges<T> | undefined, issues: ElementIssue[], locate?: ElementLocator): T[] {
  if (!change || (!change.upsert?.length && !change.remove?.length)) return items
  // a drag changes one or two elements: scanning for them (or asking the caller's index) beats indexing a thousand
  const few = (change.upsert?.length ?? 0) + (change.remove?.length ?? 0) <= 8
  const map = few ? null : new Map(items.map((item, i) => [item.id, i]))
  const index = { get: (id: string) => (map ? map.get(id) : locate ? locate(list, id) : scanFor(items, id)) }
  const out = items.slice()
  const gone = new Set<number>()
  for (const [k, id] of (change.remove ?? []).entries()) {
    const i = index.get(id)
    if (i === undefined) issues.push({ path: ['changes', list, 'remove', k], message: `There is no element "${id}" to remove` })
    else gone.add(i)
  }
  for (const [k, item] of (change.upsert ?? []).entries()) {
    const issue = elementIssue(list, item)
    if (issue) issues.push({ path: ['changes', list, 'upsert', k, ...issue.path], message: issue.message })
    const i = index.get(item.id)
    if (i === undefined) out.push(item)
    else if (gone.has(i)) issues.push({ path: ['changes', list, 'upsert', k, 'id'], message: `"${item.id}" is both removed and changed` })
    else out[i] = item
  }
  return gone.size ? out.filter((_, i) => !gone.has(i)) : out
}

/**
 * `base` with `changes` applied; unchanged elements are the same objects as in `base` (the score engine reuses
 * what it worked out for them). Issues carry paths into the request (`changes.plantings.upsert.0.points`).
 */
export function applyYardChanges(base: YardDocument, changes: YardChanges, locate?: ElementLocator): { doc: YardDocument; issues: ElementIssue[] } {
  const issues: ElementIssue[] = []
  const doc: YardDocument = { ...base }
  for (const [key, value] of Object.entries(changes.fields ?? {})) {
    if (value === null && (key === 'units' || key === 'boundary' || key === 'lines')) {
      issues.push({ path: ['changes', 'fields', key], message: 'This field cannot be cleared' })
    } else if (value === null && key !== 'zone' && key !== 'backdrop') delete (doc as Record<string, unknown>)[key]
    else (doc as Record<string, unknown>)[key] = value
  }
  doc.areas = applyList('areas', base.areas, changes.areas, issues, locate)
  doc.plantings = applyList('plantings', base.plantings, changes.plantings, issues, locate)
  if (doc.areas.length > MAX_AREAS) issues.push({ path: ['changes', 'areas'], message: `A yard has at most ${MAX_AREAS} areas` })
  if (doc.plantings.length > MAX_PLANTINGS) issues.push({ path: ['changes', 'plantings'], message: `A yard has at most ${MAX_PLANTINGS} plantings` })
  // ids are checked across the whole result: a new element may reuse the id of one kept in another list. Only
  // new elements can clash, and a drag adds none, so a few changes are checked by scanning rather than indexing.
  const where = (list: 'areas' | 'plantings', id: string) => (locate ? locate(list, id) : scanFor(base[list] as Array<{ id: string }>, id))
  const added = [
    ...(changes.areas?.upsert ?? []).filter((a) => where('areas', a.id) === undefined),
    ...(changes.plantings?.upsert ?? []).filter((p) => where('plantings', p.id) === undefined),
  ]
  const taken = (id: string) => where('areas', id) !== undefined || where('plantings', id) !== undefined || doc.lines.some((l) => l.id === id)
  const clash = added.length > 8 || changes.fields?.lines !== undefined || added.some((item, i) => taken(item.id) || added.findIndex((x) => x.id === item.id) !== i)
  if (!issues.length && clash) {
    for (const issue of duplicateIdIssues(doc)) issues.push({ path: ['changes', ...issue.path], message: issue.message })
  }
  return { doc, issues }
}

/**
 * The whole score after an update: `previous` (the answer for the update's `since`) with the changed planting
 * lines put in and removed ones dropped, in the order of `doc`'s plantings (the server's order).
 */
export function mergeScoreUpdate(previous: Score, update: ScoreUpdate, doc: Pick<YardDocument, 'plantings'>): Score {
  const lines = new Map(previous.plantings.map((p) => [p.id, p]))
  for (const id of update.removedPlantings) lines.delete(id)
  for (const line of update.plantings) lines.set(line.id, line)
  const { basis: _basis, since: _since, removedPlantings: _removed, ...rest } = update
  return { ...rest, plantings: doc.plantings.map((p) => lines.get(p.id)).filter((l) => l !== undefined) }
}
