// Advice requests (homeowner → organisation), the coordinator's queue and assignment, and the advisor's
// site visits with notes and pins. Who may act on a request is decided here, once per kind of action.
import { and, eq, inArray, desc, sql, count } from 'drizzle-orm'
import { alias } from 'drizzle-orm/mysql-core'
import { users, yards, adviceRequests, siteVisits, visitPins, visitPhotos, recommendations } from '../database/schema'
import type { AccountRow, YardRow } from '../database/schema'
import { yardAccessLevel } from './yard-access'

export type AdviceRequestRow = typeof adviceRequests.$inferSelect
export type VisitRow = typeof siteVisits.$inferSelect

export async function createAdviceRequest(owner: AccountRow, yard: YardRow, input: { message: string; preferredTimes: string }) {
  const id = await withContentionRetry(() => useDb().transaction(async (tx) => {
    // the yard row's lock makes "one open request per yard" hold for requests sent at once
    await tx.select({ id: yards.id }).from(yards).where(eq(yards.id, yard.id)).for('update')
    const [open] = await tx.select({ id: adviceRequests.id }).from(adviceRequests)
      .where(and(eq(adviceRequests.yardId, yard.id), inArray(adviceRequests.status, ['new', 'assigned']))).limit(1)
    if (open) throw createError({ status: 409, message: 'This yard already has an open request for advice', data: { fields: { message: 'A request is already open for this yard' } } })
    return insertedId(await tx.insert(adviceRequests).values({ yardId: yard.id, requesterId: owner.id, message: input.message, preferredTimes: input.preferredTimes }).$returningId())
  }))
  return getRequestView(id)
}

const requester = alias(users, 'requester')
const advisor = alias(users, 'advisor')

function requestQuery() {
  return useDb().select({
    id: adviceRequests.id, yardId: adviceRequests.yardId, yardName: yards.name, region: yards.region,
    message: adviceRequests.message, preferredTimes: adviceRequests.preferredTimes, status: adviceRequests.status,
    requesterId: adviceRequests.requesterId, requesterName: requester.name, requesterEmail: requester.email,
    advisorId: adviceRequests.advisorId, advisorName: advisor.name,
    assignedAt: adviceRequests.assignedAt, closedAt: adviceRequests.closedAt, closingNote: adviceRequests.closingNote,
    createdAt: adviceRequests.createdAt,
    visits: sql<number>`(select count(*) from ${siteVisits} where ${siteVisits.requestId} = ${adviceRequests.id})`,
  }).from(adviceRequests)
    .innerJoin(yards, eq(yards.id, adviceRequests.yardId))
    .innerJoin(requester, eq(requester.id, adviceRequests.requesterId))
    .leftJoin(advisor, eq(advisor.id, adviceRequests.advisorId))
}

async function getRequestView(id: number) {
  const [row] = await requestQuery().where(eq(adviceRequests.id, id))
  if (!row) throw createError({ status: 404, message: 'No such request' })
  return { ...row, visits: Number(row.visits) }
}

/** The request when `user` may see it: the coordinator, the requester, or the advisor assigned to it. */
export async function requireRequest(user: AccountRow, id: number) {
  const [row] = await useDb().select().from(adviceRequests).where(eq(adviceRequests.id, id)).limit(1)
  if (!row || !(user.role === 'coordinator' || row.requesterId === user.id || (row.advisorId === user.id && row.advisorId !== null))) {
    throw createError({ status: 404, message: 'No such request' })
  }
  return row
}

export async function requestDetails(user: AccountRow, id: number) {
  const row = await requireRequest(user, id)
  const view = await getRequestView(row.id)
  const visits = await useDb().select().from(siteVisits).where(eq(siteVisits.requestId, row.id)).orderBy(desc(siteVisits.visitedOn))
  return { ...view, visitList: visits }
}

/** The coordinator's queue (every request) or an advisor's list (assigned to them); newest first. */
export async function listRequests(user: AccountRow, status: 'new' | 'assigned' | 'closed' | 'open' | 'all') {
  const conditions = []
  if (status === 'open') conditions.push(inArray(adviceRequests.status, ['new', 'assigned']))
  else if (status !== 'all') conditions.push(eq(adviceRequests.status, status))
  if (user.role !== 'coordinator') conditions.push(eq(adviceRequests.advisorId, user.id))
  const rows = await requestQuery().where(and(...conditions)).orderBy(desc(adviceRequests.createdAt)).limit(500)
  return rows.map((r) => ({ ...r, visits: Number(r.visits) }))
}

export async function listYardRequests(yardId: number) {
  const rows = await requestQuery().where(eq(adviceRequests.yardId, yardId)).orderBy(desc(adviceRequests.createdAt))
  return rows.map(({ requesterEmail: _, ...r }) => ({ ...r, visits: Number(r.visits) }))
}

export async function listAdvisors() {
  const open = useDb().select({ advisorId: adviceRequests.advisorId, n: count().as('n') }).from(adviceRequests)
    .where(eq(adviceRequests.status, 'assigned')).groupBy(adviceRequests.advisorId).as('open_counts')
  const rows = await useDb().select({ id: users.id, name: users.name, email: users.email, open: open.n })
    .from(users).leftJoin(open, eq(open.advisorId, users.id)).where(eq(users.role, 'advisor')).orderBy(users.name)
  return rows.map((r) => ({ ...r, open: Number(r.open ?? 0) }))
}

/** Assigns (or reassigns) an advisor, who is mailed and may edit the yard until the request is closed. */
export async function assignAdvisor(coordinator: AccountRow, id: number, advisorId: number) {
  const db = useDb()
  const [who] = await db.select().from(users).where(eq(users.id, advisorId)).limit(1)
  if (!who || who.role !== 'advisor') throw createError({ status: 400, message: 'Choose a volunteer advisor', data: { fields: { advisorId: 'Not an advisor' } } })
  const [result] = await db.update(adviceRequests)
    .set({ advisorId, assignedBy: coordinator.id, assignedAt: new Date(), status: 'assigned' })
    .where(and(eq(adviceRequests.id, id), inArray(adviceRequests.status, ['new', 'assigned'])))
  if (result.affectedRows === 0) {
    const [exists] = await db.select({ id: adviceRequests.id }).from(adviceRequests).where(eq(adviceRequests.id, id))
    throw exists ? createError({ status: 409, message: 'This request is closed' }) : createError({ status: 404, message: 'No such request' })
  }
  const view = await getRequestView(id)
  await sendMail({
    to: who.email,
    subject: `New advice visit: ${view.yardName}`,
    text: `Hello ${who.name},\n\n${coordinator.name} asked you to advise on the yard "${view.yardName}" (${view.requesterName}).\n\n`
      + `What they would like help with:\n${view.message}\n\nPreferred times: ${view.preferredTimes || 'not given'}\n\n`
      + `You can edit the plan while the request is open:\n${appLink(`/advice/${id}`)}\n\n`
      + 'Before anyone digs, have buried utilities located (call before you dig), and keep new trees clear of overhead lines and foundations.\n',
  })
  return view
}

/** Closes a request; the advisor's editing access ends with it. */
export async function closeRequest(user: AccountRow, id: number, note?: string) {
  const row = await requireRequest(user, id)
  if (row.status === 'closed') return getRequestView(id)
  await useDb().update(adviceRequests).set({ status: 'closed', closedAt: new Date(), closingNote: note ?? null }).where(eq(adviceRequests.id, id))
  return getRequestView(id)
}

export async function createVisit(user: AccountRow, requestId: number, input: { visitedOn: string; notes: string }) {
  const row = await requireRequest(user, requestId)
  if (row.advisorId !== user.id) throw createError({ status: 403, message: 'Only the advisor assigned to this request records visits' })
  if (row.status !== 'assigned') throw createError({ status: 409, message: 'This request is closed' })
  const id = insertedId(await useDb().insert(siteVisits).values({ requestId, yardId: row.yardId, advisorId: user.id, visitedOn: input.visitedOn, notes: input.notes }).$returningId())
  const [visit] = await useDb().select().from(siteVisits).where(eq(siteVisits.id, id))
  return visit!
}

/**
 * The visit when `user` may see it (its advisor, or anyone who may view the yard); `edit` asks for the
 * advisor while the request is still open.
 */
export async function requireVisit(user: AccountRow, visitId: number, need: 'view' | 'edit' = 'view') {
  const db = useDb()
  const [row] = await db.select({ visit: siteVisits, request: adviceRequests, yard: yards }).from(siteVisits)
    .innerJoin(adviceRequests, eq(adviceRequests.id, siteVisits.requestId)).innerJoin(yards, eq(yards.id, siteVisits.yardId))
    .where(eq(siteVisits.id, visitId)).limit(1)
  if (!row) throw createError({ status: 404, message: 'No such visit' })
  const isAdvisor = row.visit.advisorId === user.id
  const access = isAdvisor ? 'advisor' : user.role === 'coordinator' ? 'view' : await yardAccessLevel(user, row.yard)
  if (!access) throw createError({ status: 404, message: 'No such visit' })
  if (need === 'edit' && !(isAdvisor && row.request.status === 'assigned' && row.request.advisorId === user.id)) {
    throw createError({ status: 403, message: 'Only the assigned advisor changes a visit, while the request is open' })
  }
  return { ...row, isAdvisor }
}

export async function visitDetails(user: AccountRow, visitId: number) {
  const { visit, request, yard, isAdvisor } = await requireVisit(user, visitId)
  const db = useDb()
  const [pins, photos, recs, [who]] = await Promise.all([
    db.select().from(visitPins).where(eq(visitPins.visitId, visit.id)).orderBy(visitPins.id),
    db.select({ id: visitPhotos.id, caption: visitPhotos.caption, contentType: visitPhotos.contentType, bytes: visitPhotos.bytes, createdAt: visitPhotos.createdAt })
      .from(visitPhotos).where(eq(visitPhotos.visitId, visit.id)).orderBy(visitPhotos.id),
    db.select().from(recommendations).where(eq(recommendations.visitId, visit.id)).orderBy(recommendations.id),
    db.select({ name: users.name }).from(users).where(eq(users.id, visit.advisorId)),
  ])
  return {
    ...visit, advisorName: who?.name ?? null, yardName: yard.name, requestStatus: request.status,
    canEdit: isAdvisor && request.status === 'assigned' && request.advisorId === user.id,
    pins, photos: photos.map((p) => ({ ...p, url: `/api/visits/${visit.id}/photos/${p.id}` })), recommendations: recs,
  }
}

export async function updateVisitNotes(user: AccountRow, visitId: number, notes: string) {
  await requireVisit(user, visitId, 'edit')
  await useDb().update(siteVisits).set({ notes }).where(eq(siteVisits.id, visitId))
  return visitDetails(user, visitId)
}

export async function addPin(user: AccountRow, visitId: number, pin: { x: number; y: number; comment: string }) {
  await requireVisit(user, visitId, 'edit')
  const id = insertedId(await useDb().insert(visitPins).values({ visitId, ...pin }).$returningId())
  const [row] = await useDb().select().from(visitPins).where(eq(visitPins.id, id))
  return row!
}

export async function deletePin(user: AccountRow, visitId: number, pinId: number) {
  await requireVisit(user, visitId, 'edit')
  const [r] = await useDb().delete(visitPins).where(and(eq(visitPins.id, pinId), eq(visitPins.visitId, visitId)))
  if (r.affectedRows === 0) throw createError({ status: 404, message: 'No such pin' })
}

/** Pins of every visit to a yard, for showing on the plan. */
export async function yardPins(yardId: number) {
  return useDb().select({ id: visitPins.id, visitId: visitPins.visitId, x: visitPins.x, y: visitPins.y, comment: visitPins.comment, createdAt: visitPins.createdAt })
    .from(visitPins).innerJoin(siteVisits, eq(siteVisits.id, visitPins.visitId)).where(eq(siteVisits.yardId, yardId)).orderBy(visitPins.id)
}
