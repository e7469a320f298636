// Work marked done: plantings and areas planted (to plant → there now) or removed (to remove → gone) on a date.
// The save, the yard's share history row and the pledge's shares are one transaction; the yard row is locked.
import { and, asc, eq, sql } from 'drizzle-orm'
import { yards, yardShareHistory, type YardRow } from '../database/schema'
import type { YardDocument } from '#shared/schemas/yard-document'
import { markWorkDone, WorkError } from '#shared/utils/yard-edits'
import type { MarkWorkBody } from '#shared/schemas/yard'
import { recordPledgedShares, yardShares } from './drives'

/** The document with the work done; a 400 names the id that cannot take it. */
export function documentAfterWork(doc: YardDocument, body: Pick<MarkWorkBody, 'action' | 'ids' | 'date'>): YardDocument {
  const next: YardDocument = { ...doc, areas: doc.areas.map((a) => ({ ...a })), plantings: doc.plantings.map((p) => ({ ...p })), lines: [...doc.lines] }
  try {
    markWorkDone(next, body)
  } catch (e) {
    if (e instanceof WorkError) throw createError({ status: 400, message: e.message, data: { fields: { [`ids.${e.index}`]: e.message } } })
    throw e
  }
  return next
}

export async function markWork(yard: YardRow, body: MarkWorkBody) {
  const document = documentAfterWork(yard.document, body)
  const [before, after] = await Promise.all([yardShares(yard.document, yard.region), yardShares(document, yard.region)])
  const db = useDb()
  const saved = await db.transaction(async (tx) => {
    const [row] = await tx.select({ version: yards.version }).from(yards).where(eq(yards.id, yard.id)).for('update')
    if (!row || row.version !== body.version) {
      throw createError({ status: 409, message: 'Someone saved this yard after you opened it', data: { currentVersion: row?.version ?? null, fields: { version: 'Out of date' } } })
    }
    await tx.update(yards).set({ document, version: sql`${yards.version} + 1` }).where(and(eq(yards.id, yard.id), eq(yards.version, body.version)))
    await tx.insert(yardShareHistory).values({
      yardId: yard.id, day: body.date, action: body.action, items: body.ids.length,
      countShare: after.shares.count.share, areaShare: after.shares.area.share, volumeShare: after.shares.volume.share,
      plannedCountShare: after.planned.count.share, plannedAreaShare: after.planned.area.share, plannedVolumeShare: after.planned.volume.share,
      nativeAreaAdded: Math.max(0, after.shares.area.native - before.shares.area.native),
      lawnRemoved: Math.max(0, before.lawnArea - after.lawnArea),
    })
    const [fresh] = await tx.select().from(yards).where(eq(yards.id, yard.id))
    await recordPledgedShares(fresh!, body.date, tx)
    return fresh!
  })
  return { id: saved.id, version: saved.version, updatedAt: saved.updatedAt, document, now: after.shares, planned: after.planned }
}

/** A yard's share history, oldest first. */
export async function yardHistory(yardId: number) {
  const rows = await useDb().select().from(yardShareHistory).where(eq(yardShareHistory.yardId, yardId)).orderBy(asc(yardShareHistory.day), asc(yardShareHistory.id))
  return {
    points: rows.map((r) => ({
      day: r.day, action: r.action, items: r.items,
      now: { count: r.countShare, area: r.areaShare, volume: r.volumeShare },
      planned: { count: r.plannedCountShare, area: r.plannedAreaShare, volume: r.plannedVolumeShare },
      nativeAreaAdded: r.nativeAreaAdded, lawnRemoved: r.lawnRemoved,
    })),
  }
}
