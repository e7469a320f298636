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
import { scoreDocument, type MeasureMemo } from './scoring'

interface Basis {
  userId: number
  doc: YardDocument
  memo: MeasureMemo
  lines: Map<string, ScoredPlanting>
  until: number
}

const BASIS_TTL_MS = 10 * 60_000
// a few per user: requests can overlap while someone drags, and each answer's basis must still be there for
// the request after it
const PER_USER = 6
const MAX_BASES = 500
const bases = new Map<string, Basis>()

function remember(userId: number, doc: YardDocument, memo: MeasureMemo, score: Score): string {
  const token = randomBytes(18).toString('base64url')
  const now = Date.now()
  let mine = 0
  // Map order is insertion order, so the first entries are the oldest
  for (const [key, b] of [...bases].reverse()) {
    if (b.until < now || (b.userId === userId && ++mine >= PER_USER)) bases.delete(key)
  }
  while (bases.size >= MAX_BASES) bases.delete(bases.keys().next().value!)
  bases.set(token, { userId, doc, memo, lines: new Map(score.plantings.map((p) => [p.id, p])), until: now + BASIS_TTL_MS })
  return token
}

const sameLine = (a: ScoredPlanting, b: ScoredPlanting) =>
  a.status === b.status && a.layer === b.layer && a.count === b.count && a.area === b.area && a.volume === b.volume && a.cultivar === b.cultivar

/** The score for a request to POST /api/score by `userId`: of a whole document, or of changes to a basis. */
export async function scoreForRequest(userId: number, request: ScoreRequest): Promise<ScoreWithBasis | ScoreUpdate> {
  if (request.kind === 'document') {
    const memo: MeasureMemo = new WeakMap()
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
  const changed = score.plantings.filter((line) => { const was = basis.lines.get(line.id); return !was || !sameLine(was, line) })
  const ids = new Set(score.plantings.map((p) => p.id))
  const removedPlantings = [...basis.lines.keys()].filter((id) => !ids.has(id))
  const token = remember(userId, doc, basis.memo, score)
  return { ...score, plantings: changed, removedPlantings, since: request.basis, basis: token }
}
