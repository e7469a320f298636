// Recommendations: an advisor's structured change with the shares it predicts, and the owner's decision.
// The change is applied by shared/utils/recommendations.ts, the same code the editor's undoable edit runs.
import type { H3Event } from 'h3'
import { and, eq, desc } from 'drizzle-orm'
import { recommendations, siteVisits, users } from '../database/schema'
import { yardDocument, type YardDocument } from '#shared/schemas/yard-document'
import type { RecommendationChange, PredictedShares } from '#shared/schemas/advice'
import { applyRecommendation, describeRecommendation, RecommendationError } from '#shared/utils/recommendations'
import type { AccountRow, YardRow } from '../database/schema'
import { requireVisit } from './advice'
import { yardShares } from './drives'
import { updateYard } from './yards'

/** The document after the change, checked like any saved document; a 400 names the field when it does not fit. */
export function changedDocument(doc: YardDocument, change: RecommendationChange, newId: string): YardDocument {
  let next: YardDocument
  try {
    next = applyRecommendation(doc, change, newId)
  } catch (e) {
    if (e instanceof RecommendationError) throw createError({ status: 400, message: e.message, data: { fields: { [e.field]: e.message } } })
    throw e
  }
  const checked = yardDocument.safeParse(next)
  if (!checked.success) {
    const issue = checked.error.issues[0]!
    const field = change.kind === 'convertLawn' ? 'change.points' : 'change'
    throw createError({ status: 400, message: `The changed plan would not be valid: ${issue.message}`, data: { fields: { [field]: issue.message } } })
  }
  return checked.data
}

export async function predict(yard: YardRow, change: RecommendationChange): Promise<PredictedShares> {
  const after = changedDocument(yard.document, change, 'recommended')
  const [b, a] = await Promise.all([yardShares(yard.document, yard.region), yardShares(after, yard.region)])
  // an accepted recommendation is plan items: it changes the plan, not the yard as it is now
  return { before: b.planned, after: a.planned }
}

export async function previewRecommendation(user: AccountRow, visitId: number, change: RecommendationChange) {
  const { yard } = await requireVisit(user, visitId, 'edit')
  return { summary: describeRecommendation(yard.document, change), predicted: await predict(yard, change), basedOnVersion: yard.version }
}

export async function createRecommendation(user: AccountRow, visitId: number, change: RecommendationChange) {
  const { yard, visit } = await requireVisit(user, visitId, 'edit')
  const predicted = await predict(yard, change)
  const id = insertedId(await useDb().insert(recommendations).values({
    visitId: visit.id, yardId: yard.id, change, summary: describeRecommendation(yard.document, change), predicted, basedOnVersion: yard.version,
  }).$returningId())
  return getRecommendation(id)
}

async function getRecommendation(id: number) {
  const [row] = await useDb().select().from(recommendations).where(eq(recommendations.id, id)).limit(1)
  if (!row) throw createError({ status: 404, message: 'No such recommendation' })
  return row
}

export async function listYardRecommendations(yardId: number) {
  return useDb().select({
    id: recommendations.id, visitId: recommendations.visitId, change: recommendations.change, summary: recommendations.summary,
    predicted: recommendations.predicted, basedOnVersion: recommendations.basedOnVersion, status: recommendations.status,
    declineReason: recommendations.declineReason, decidedAt: recommendations.decidedAt, createdAt: recommendations.createdAt,
    advisorName: users.name, visitedOn: siteVisits.visitedOn,
  }).from(recommendations).innerJoin(siteVisits, eq(siteVisits.id, recommendations.visitId)).innerJoin(users, eq(users.id, siteVisits.advisorId))
    .where(eq(recommendations.yardId, yardId)).orderBy(desc(recommendations.id))
}

/** The element id an accepted recommendation adds, the same on the server and in the editor. */
export const recommendationElementId = (id: number) => `rec-${id}`

async function decide(event: H3Event, id: number) {
  const rec = await getRecommendation(id)
  const { user, yard } = await requireYardAccess(event, rec.yardId, 'owner')
  if (rec.status !== 'proposed') throw createError({ status: 409, message: `This recommendation was already ${rec.status}` })
  return { rec, user, yard }
}

/**
 * Accepts: with `apply: 'server'` the change is made to the stored plan as a versioned save (409 on a stale
 * version, and the recommendation stays proposed); with `apply: 'editor'` the editor made it as an undoable
 * edit and saves the plan itself, so only the decision is recorded.
 */
export async function acceptRecommendation(event: H3Event, _user: AccountRow, id: number, body: { version: number; apply: 'server' | 'editor' }) {
  const { rec, user, yard } = await decide(event, id)
  const db = useDb()
  const [claimed] = await db.update(recommendations).set({ status: 'accepted', decidedBy: user.id, decidedAt: new Date() })
    .where(and(eq(recommendations.id, rec.id), eq(recommendations.status, 'proposed')))
  if (claimed.affectedRows === 0) throw createError({ status: 409, message: 'This recommendation was already decided' })
  if (body.apply === 'editor') return { recommendation: await getRecommendation(rec.id), yard: null }
  try {
    const document = changedDocument(yard.document, rec.change, recommendationElementId(rec.id))
    const saved = await updateYard(yard, 'owner', { version: body.version, document })
    await db.update(recommendations).set({ appliedVersion: saved.version }).where(eq(recommendations.id, rec.id))
    return { recommendation: await getRecommendation(rec.id), yard: saved }
  } catch (e) {
    await db.update(recommendations).set({ status: 'proposed', decidedBy: null, decidedAt: null }).where(eq(recommendations.id, rec.id))
    throw e
  }
}

/**
 * Takes an accepted recommendation back to proposed: the owner undid, in the editor, the edit that accepted it
 * (the editor saves the plan without it). 409 unless it is accepted.
 */
export async function reopenRecommendation(event: H3Event, id: number) {
  const rec = await getRecommendation(id)
  await requireYardAccess(event, rec.yardId, 'owner')
  const [reopened] = await useDb().update(recommendations).set({ status: 'proposed', decidedBy: null, decidedAt: null, appliedVersion: null })
    .where(and(eq(recommendations.id, rec.id), eq(recommendations.status, 'accepted')))
  if (reopened.affectedRows === 0) throw createError({ status: 409, message: `Only an accepted recommendation can be taken back; this one is ${rec.status}` })
  return { recommendation: await getRecommendation(rec.id) }
}

export async function declineRecommendation(event: H3Event, _user: AccountRow, id: number, reason: string) {
  const { rec, user } = await decide(event, id)
  await useDb().update(recommendations).set({ status: 'declined', declineReason: reason, decidedBy: user.id, decidedAt: new Date() })
    .where(and(eq(recommendations.id, rec.id), eq(recommendations.status, 'proposed')))
  return { recommendation: await getRecommendation(rec.id) }
}

