// Re-scoring a yard as it is edited. A whole document is scored and kept here, in this instance's memory, under
// a random basis; the editor's next request sends only its changes against that basis. The changed document
// shares every untouched element with the one before, so the engine's per-planting results are reused, and
// the answer lists only the planting lines that changed. A basis is private to the user who made it, lives a
// few minutes, and a basis this instance does not hold (expired, another instance) answers 409: the editor then
// posts the whole document.
import { randomBytes } from 'node:crypto'
import type { YardDocument } from '#shared/schemas/yard-document'
import type { Score, ScoreRequest, ScoredPlanting, ScoreUpdate, ScoreWithBasis } from '#shared/schemas/score'
import { applyYardChanges } from '#shared/utils/yard-changes'
import { newMeasureMemo, scoreDocument, type MeasureMemo } from './scoring'

interface Basis {
  userId: number
  doc: YardDocument
  memo: MeasureMemo
  lines: ScoredPlanting[]
  until: number
}

const BASIS_TTL_MS = 10 * 60_000
// a few per user: requests can overlap while someone drags, and each answer's basis must still be there for
// the request after it
const PER_USER = 6
const MAX_BASES = 500
const bases = new Map<string, Basis>()
const byUser = new Map<number, string[]>()

function forget(token: string) {
  const b = bases.get(token)
  if (!b) return
  bases.delete(token)
  const mine = byUser.get(b.userId)
  if (mine) {
    mine.splice(mine.indexOf(token), 1)
    if (!mine.length) byUser.delete(b.userId)
  }
}

function remember(userId: number, doc: YardDocument, memo: MeasureMemo, score: Score): string {
  const token = randomBytes(18).toString('base64url')
  const now = Date.now()
  // every basis lives as long, so the Map's insertion order is also the order they expire in
  for (const [key, b] of bases) { if (b.until >= now) break; forget(key) }
  const mine = byUser.get(userId) ?? []
  while (mine.length >= PER_USER) forget(mine[0]!)
  while (bases.size >= MAX_BASES) forget(bases.keys().next().value!)
  bases.set(token, { userId, doc, memo, lines: score.plantings, until: now + BASIS_TTL_MS })
  mine.push(token)
  byUser.set(userId, mine)
  return token
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

/** The score for a request to POST /api/score by `userId`: of a whole document, or of changes to a basis. */
export async function scoreForRequest(userId: number, request: ScoreRequest): Promise<ScoreWithBasis | ScoreUpdate> {
  if (request.kind === 'document') {
    const memo: MeasureMemo = newMeasureMemo()
    const score = await scoreDocument(request.doc, undefined, memo)
    return { ...score, basis: remember(userId, request.doc, memo, score) }
  }
  const basis = bases.get(request.basis)
  if (!basis || basis.userId !== userId || basis.until < Date.now()) {
    throw createError({ status: 409, message: 'The server no longer holds that version of the yard; send the whole yard', data: { fields: { basis: 'Unknown or expired basis' } } })
  }
  const { doc, issues } = applyYardChanges(basis.doc, request.changes)
  if (issues.length) badRequest(Object.fromEntries(issues.map((i) => [i.path.join('.'), i.message])))
  const score = await scoreDocument(doc, undefined, basis.memo)
  const { changed, removed } = changedLines(basis.lines, score.plantings)
  const token = remember(userId, doc, basis.memo, score)
  return { ...score, plantings: changed, removedPlantings: removed, since: request.basis, basis: token }
}
