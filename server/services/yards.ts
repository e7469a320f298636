import { and, eq, sql } from 'drizzle-orm'
import { yards, yardMembers, users } from '../database/schema'
import { emptyYardDocument, type YardDocument } from '#shared/schemas/yard-document'
import type { CreateYardBody, UpdateYardBody } from '#shared/schemas/yard'
import type { AccountRow, YardRow } from '../database/schema'
import type { YardAccess } from './yard-access'
import { recordPledgedShares } from './drives'
import { yardListQuery } from './yard-list'

/** The columns kept beside the document (for queries and lists) follow the document. */
function columnsFrom(doc: YardDocument) {
  return {
    zone: doc.zone ?? null,
    lastSpringFrost: doc.frost?.lastSpring ?? null,
    firstFallFrost: doc.frost?.firstFall ?? null,
    units: doc.units,
  }
}

export function yardView(yard: YardRow, access: YardAccess) {
  return {
    id: yard.id,
    name: yard.name,
    region: yard.region,
    zone: yard.zone,
    frost: { lastSpring: yard.lastSpringFrost, firstFall: yard.firstFallFrost },
    units: yard.units,
    version: yard.version,
    document: { ...yard.document, name: yard.name, region: yard.region } as YardDocument,
    access,
    ownerId: yard.ownerId,
    createdAt: yard.createdAt,
    updatedAt: yard.updatedAt,
  }
}

export async function createYard(owner: AccountRow, body: CreateYardBody) {
  const doc = { ...(body.document ?? emptyYardDocument()), name: body.name, region: body.region }
  const db = useDb()
  const id = insertedId(await db.insert(yards).values({ ownerId: owner.id, name: body.name, region: body.region, document: doc, ...columnsFrom(doc) }).$returningId())
  const [yard] = await db.select().from(yards).where(eq(yards.id, id))
  return yardView(yard!, 'owner')
}

/**
 * Saves a new name and/or document when `version` is still the stored one; else 409 with the current version,
 * so the editor can offer "load theirs" or "keep mine as a copy". The compare-and-set is one UPDATE.
 */
export async function updateYard(yard: YardRow, access: YardAccess, body: UpdateYardBody) {
  const name = body.name ?? yard.name
  const doc = body.document ? { ...body.document, name, region: body.document.region ?? yard.region } : { ...yard.document, name }
  const db = useDb()
  const [result] = await db.update(yards)
    .set({ name, region: doc.region ?? yard.region, document: doc, ...columnsFrom(doc), version: sql`${yards.version} + 1` })
    .where(and(eq(yards.id, yard.id), eq(yards.version, body.version)))
  const [fresh] = await db.select().from(yards).where(eq(yards.id, yard.id))
  if (result.affectedRows === 0) {
    throw createError({
      status: 409,
      message: 'Someone saved this yard after you opened it',
      data: { currentVersion: fresh?.version ?? null, fields: { version: 'Out of date' } },
    })
  }
  // a pledged yard keeps its drive shares current and gets the day's snapshot; the save stands even if this fails
  await recordPledgedShares(fresh!).catch((e) => console.error('[wildward] pledge shares after save:', (e as Error).message))
  // the editor has the document it sent: the answer is only what the save changed
  return { id: fresh!.id, version: fresh!.version, updatedAt: fresh!.updatedAt }
}

/** Yards the user owns or is a member of, newest first (without their documents). */
export async function listYardsFor(user: AccountRow) {
  const seen = new Set<number>()
  // a yard listed as owned is not listed again should its owner also hold a member row
  const rows = (await yardListQuery(useDb(), user.id)).filter((r) => !seen.has(r.id) && !!seen.add(r.id))
  rows.sort((a, b) => new Date(b.updatedAt).getTime() - new Date(a.updatedAt).getTime() || b.id - a.id)
  return rows.map(({ memberRole, ...r }) => ({
    ...r,
    plantings: Number(r.plantings),
    access: (r.ownerId === user.id ? 'owner' : memberRole === 'editor' ? 'edit' : 'view') as YardAccess,
  }))
}
