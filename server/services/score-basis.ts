// Re-scoring a yard as it is edited. A whole document is scored and kept here, in this instance's memory, under
// a random basis; the editor's next request sends only its changes against that basis. The changed document
// shares every untouched element with the one before, so the engine's per-planting results are reused, and
// the answer lists only the planting lines that changed. A basis is private to the user who made it, lives a
// few minutes, and a basis this instance does not hold (expired, another instance) answers 409: the editor then
// posts the whole document.
import { randomBytes } from 'node:crypto'
import type { ScoreRequest, ScoreUpdate, ScoreWithBasis } from '#shared/schemas/score'
import { applyYardChanges } from '#shared/utils/yard-changes'
import { elementLocator, rescore, scoreWithState, type ScoreState } from './rescore'

interface Basis {
  userId: number
  state: ScoreState
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

function remember(userId: number, state: ScoreState): string {
  const token = randomBytes(18).toString('base64url')
  const now = Date.now()
  // every basis lives as long, so the Map's insertion order is also the order they expire in
  for (const [key, b] of bases) { if (b.until >= now) break; forget(key) }
  const mine = byUser.get(userId) ?? []
  while (mine.length >= PER_USER) forget(mine[0]!)
  while (bases.size >= MAX_BASES) forget(bases.keys().next().value!)
  bases.set(token, { userId, state, until: now + BASIS_TTL_MS })
  mine.push(token)
  byUser.set(userId, mine)
  return token
}

/** The score for a request to POST /api/score by `userId`: of a whole document, or of changes to a basis. */
export async function scoreForRequest(userId: number, request: ScoreRequest): Promise<ScoreWithBasis | ScoreUpdate> {
  if (request.kind === 'document') {
    const { score, state } = await scoreWithState(request.doc)
    return { ...score, basis: remember(userId, state) }
  }
  const basis = bases.get(request.basis)
  if (!basis || basis.userId !== userId || basis.until < Date.now()) {
    throw createError({ status: 409, message: 'The server no longer holds that version of the yard; send the whole yard', data: { fields: { basis: 'Unknown or expired basis' } } })
  }
  const before = basis.state
  const { doc, issues } = applyYardChanges(before.doc, request.changes, elementLocator(before))
  if (issues.length) badRequest(Object.fromEntries(issues.map((i) => [i.path.join('.'), i.message])))
  const { score, state, changed, removed } = await rescore(before, doc, request.changes)
  return { ...score, plantings: changed, removedPlantings: removed, since: request.basis, basis: remember(userId, state) }
}
