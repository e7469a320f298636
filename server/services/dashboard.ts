// The coordinator's dashboard for a drive: each figure is one aggregate query over the pledges' indexed
// columns (never a loop over yards). Only pledges whose households consented count, and no row names a yard,
// its address or its owner.
import { GOAL_TOLERANCE } from '#shared/utils/score/goal'
import { and, eq, gte, lte, asc, desc, like, sql, type SQL } from 'drizzle-orm'
import { pledges, shareSnapshots, driveSummaries, driveViewCache, type DriveRow } from '../database/schema'
import type { PledgesQuery } from '#shared/schemas/drives'
import { driveView, shareColumn, today } from './drives'
import { csvCell } from '#shared/utils/csv'

export const HISTOGRAM_BINS = 10
// a neighbourhood with fewer consenting yards than this is folded into "Other", so no household stands out
export const MIN_NEIGHBOURHOOD = 3
// a cached summary older than this is computed again even when no change was recorded (a pledged yard deleted)
export const SUMMARY_MAX_AGE_MS = 60_000

const consenting = (drive: DriveRow) => and(eq(pledges.driveId, drive.id), eq(pledges.consent, true))
const num = (x: unknown) => Number(x ?? 0)

const binColumn = (drive: DriveRow) => (drive.certifies === 'count' ? pledges.countBin : drive.certifies === 'area' ? pledges.areaBin : pledges.volumeBin)

/**
 * The summary: the consenting totals, the histogram (the database keeps each pledge's bin, so it is an index-only
 * count) and the number withheld, three aggregate queries run side by side over covering indexes.
 */
export async function driveSummary(drive: DriveRow) {
  const db = useDb()
  const col = shareColumn(drive.certifies)
  const bin = binColumn(drive)
  const [[totals], bins, [withheld]] = await Promise.all([
    db.select({
      pledged: sql<number>`COUNT(*)`,
      reached: sql<number>`SUM(${pledges.status} IN ('reached', 'verified'))`,
      verified: sql<number>`SUM(${pledges.status} = 'verified')`,
      meanShare: sql<number>`AVG(${col})`,
      nativeCoverAdded: sql<number>`SUM(${pledges.areaNative} - ${pledges.baseAreaNative})`,
      lawnConverted: sql<number>`SUM(${pledges.baseLawnArea} - ${pledges.lawnArea})`,
    }).from(pledges).where(consenting(drive)),
    db.select({ bin, yards: sql<number>`COUNT(*)` }).from(pledges).where(consenting(drive)).groupBy(bin),
    db.select({ n: sql<number>`COUNT(*)` }).from(pledges).where(and(eq(pledges.driveId, drive.id), eq(pledges.consent, false))),
  ])
  const byBin = new Map(bins.map((b) => [num(b.bin), num(b.yards)]))
  // bins of width 1/10 over [0, 1]; a share of exactly 1 is in the last
  const histogram = Array.from({ length: HISTOGRAM_BINS }, (_, i) => ({ from: i / HISTOGRAM_BINS, to: (i + 1) / HISTOGRAM_BINS, yards: byBin.get(i) ?? 0 }))
  return {
    drive: driveView(drive),
    target: drive.target,
    goal: Number(drive.goal),
    certifies: drive.certifies,
    pledged: num(totals?.pledged),
    reached: num(totals?.reached),
    verified: num(totals?.verified),
    withheld: num(withheld?.n),
    meanShare: totals?.meanShare == null ? null : Number(totals.meanShare),
    nativeCoverAdded: Math.round(num(totals?.nativeCoverAdded) * 10) / 10,
    lawnConverted: Math.round(num(totals?.lawnConverted) * 10) / 10,
    histogram,
  }
}

export type DriveSummary = Awaited<ReturnType<typeof driveSummary>>

// a stored body is reused while it was computed for the drive's current version, within the last minute
const isFresh = (body: unknown, bodyVersion: number | null, version: number, computedAt: Date | null) =>
  !!body && bodyVersion === version && !!computedAt && Date.now() - computedAt.getTime() < SUMMARY_MAX_AGE_MS

/**
 * A dashboard view of a drive (summary, progress, neighbourhoods) from the shared cache while the drive's pledges
 * have not changed since it was computed (and for at most a minute); computed and stored otherwise. The drive's
 * version and the stored view come in one query.
 */
export async function cachedDriveView<T extends object>(drive: DriveRow, view: 'summary' | 'progress' | 'neighbourhoods', compute: (drive: DriveRow) => Promise<T>): Promise<T> {
  const db = useDb()
  const [row] = await db.select({ version: driveSummaries.version, body: driveViewCache.body, bodyVersion: driveViewCache.bodyVersion, computedAt: driveViewCache.computedAt })
    .from(driveSummaries).leftJoin(driveViewCache, and(eq(driveViewCache.driveId, driveSummaries.driveId), eq(driveViewCache.view, view)))
    .where(eq(driveSummaries.driveId, drive.id)).limit(1)
  if (row && isFresh(row.body, row.bodyVersion, row.version, row.computedAt)) return row.body as T
  // the version read before computing: a change made meanwhile leaves the stored body out of date, as it should
  const version = row?.version ?? 1
  if (!row) await db.insert(driveSummaries).ignore().values({ driveId: drive.id, version })
  const body = await compute(drive)
  const stored = { body: body as Record<string, unknown>, bodyVersion: version, computedAt: new Date() }
  await db.insert(driveViewCache).values({ driveId: drive.id, view, ...stored }).onDuplicateKeyUpdate({ set: stored })
  return body
}

function days(from: string, to: string): string[] {
  const out: string[] = []
  for (let t = Date.parse(`${from}T00:00:00Z`), end = Date.parse(`${to}T00:00:00Z`); t <= end && out.length < 2000; t += 86_400_000) out.push(new Date(t).toISOString().slice(0, 10))
  return out
}

/**
 * Per day of the drive so far: yards pledged, and yards whose latest snapshot is at or above the goal. The
 * second comes from the day-to-day changes of each yard's reached/not-reached state (a window over snapshots).
 */
export async function driveProgress(drive: DriveRow) {
  const db = useDb()
  const end = drive.endsOn < today() ? drive.endsOn : today()
  const snapCol = drive.certifies === 'count' ? shareSnapshots.countShare : drive.certifies === 'area' ? shareSnapshots.areaShare : shareSnapshots.volumeShare
  const goal = Number(drive.goal)
  // meetsGoal in SQL: at or above the goal, less the same rounding tolerance
  const atGoal = goal - GOAL_TOLERANCE
  const [changes] = await db.execute(sql`
    SELECT d.day AS day, SUM(d.delta) AS delta FROM (
      SELECT ${shareSnapshots.day} AS day,
        (${snapCol} >= ${atGoal}) - COALESCE(LAG(${snapCol} >= ${atGoal}) OVER (PARTITION BY ${shareSnapshots.yardId} ORDER BY ${shareSnapshots.day}), 0) AS delta
      FROM ${shareSnapshots} JOIN ${pledges} ON ${pledges.yardId} = ${shareSnapshots.yardId}
      WHERE ${pledges.driveId} = ${drive.id} AND ${pledges.consent} = 1 AND ${shareSnapshots.day} >= ${pledges.pledgedOn} AND ${shareSnapshots.day} <= ${end}
    ) d GROUP BY d.day`) as unknown as [Array<{ day: string | Date; delta: unknown }>]
  const joined = await db.select({ day: pledges.pledgedOn, n: sql<number>`COUNT(*)` }).from(pledges).where(consenting(drive)).groupBy(pledges.pledgedOn)
  const dayKey = (d: string | Date) => (d instanceof Date ? d.toISOString().slice(0, 10) : String(d).slice(0, 10))
  const reachedDelta = new Map(changes.map((c) => [dayKey(c.day), num(c.delta)]))
  const pledgedDelta = new Map(joined.map((j) => [dayKey(j.day), num(j.n)]))
  let pledged = 0
  let reached = 0
  // pledges made before the drive's first day (imported) count from the start
  for (const [d, n] of pledgedDelta) if (d < drive.startsOn) pledged += n
  for (const [d, n] of reachedDelta) if (d < drive.startsOn) reached += n
  return {
    goal, certifies: drive.certifies, target: drive.target,
    points: days(drive.startsOn, end).map((day) => {
      pledged += pledgedDelta.get(day) ?? 0
      reached += reachedDelta.get(day) ?? 0
      return { day, pledged, reached }
    }),
  }
}

export async function driveNeighbourhoods(drive: DriveRow) {
  const col = shareColumn(drive.certifies)
  const rows = await useDb().select({
    neighbourhood: pledges.neighbourhood,
    yards: sql<number>`COUNT(*)`,
    reached: sql<number>`SUM(${pledges.status} IN ('reached', 'verified'))`,
    verified: sql<number>`SUM(${pledges.status} = 'verified')`,
    shareSum: sql<number>`SUM(${col})`,
  }).from(pledges).where(consenting(drive)).groupBy(pledges.neighbourhood)
  const shown: Array<{ neighbourhood: string; yards: number; reached: number; verified: number; meanShare: number }> = []
  const other = { neighbourhood: 'Other neighbourhoods', yards: 0, reached: 0, verified: 0, shareSum: 0 }
  for (const r of rows) {
    const row = { neighbourhood: r.neighbourhood, yards: num(r.yards), reached: num(r.reached), verified: num(r.verified), shareSum: num(r.shareSum) }
    if (row.yards < MIN_NEIGHBOURHOOD) {
      other.yards += row.yards; other.reached += row.reached; other.verified += row.verified; other.shareSum += row.shareSum
    } else shown.push({ ...row, meanShare: row.shareSum / row.yards })
  }
  shown.sort((a, b) => b.yards - a.yards || a.neighbourhood.localeCompare(b.neighbourhood))
  if (other.yards) shown.push({ neighbourhood: other.neighbourhood, yards: other.yards, reached: other.reached, verified: other.verified, meanShare: other.shareSum / other.yards })
  return { minGroup: MIN_NEIGHBOURHOOD, items: shown.map((s) => ({ neighbourhood: s.neighbourhood, yards: s.yards, reached: s.reached, verified: s.verified, meanShare: Math.round(s.meanShare * 1000) / 1000 })) }
}

function tableFilter(drive: DriveRow, q: PledgesQuery): SQL | undefined {
  const col = shareColumn(drive.certifies)
  const conditions = [consenting(drive)]
  if (q.status !== 'any') conditions.push(eq(pledges.status, q.status))
  if (q.neighbourhood) conditions.push(like(pledges.neighbourhood, containsPattern(q.neighbourhood)))
  if (q.minShare !== undefined) conditions.push(gte(col, q.minShare))
  if (q.maxShare !== undefined) conditions.push(lte(col, q.maxShare))
  return and(...conditions)
}

function tableColumns(drive: DriveRow) {
  return {
    reference: pledges.id, neighbourhood: pledges.neighbourhood, status: pledges.status, pledgedOn: pledges.pledgedOn,
    share: shareColumn(drive.certifies), baseShare: pledges.baseShare,
    countShare: pledges.countShare, areaShare: pledges.areaShare, volumeShare: pledges.volumeShare,
    nativeCoverAdded: sql<number>`${pledges.areaNative} - ${pledges.baseAreaNative}`,
    lawnConverted: sql<number>`${pledges.baseLawnArea} - ${pledges.lawnArea}`,
    updatedAt: pledges.updatedAt,
  }
}

function tableOrder(drive: DriveRow, q: PledgesQuery) {
  const col = shareColumn(drive.certifies)
  const key = q.sort === 'share' ? col : q.sort === 'neighbourhood' ? pledges.neighbourhood : q.sort === 'status' ? pledges.status
    : q.sort === 'change' ? sql`${col} - ${pledges.baseShare}` : pledges.pledgedOn
  const dir = q.dir === 'asc' ? asc : desc
  return [dir(key), dir(pledges.id)]
}

/** The anonymised table of consenting pledges: a reference number, never the yard's name or owner. */
export async function pledgeTable(drive: DriveRow, q: PledgesQuery) {
  const db = useDb()
  const where = tableFilter(drive, q)
  const [counted, rows] = await Promise.all([
    db.select({ n: sql<number>`COUNT(*)` }).from(pledges).where(where),
    db.select(tableColumns(drive)).from(pledges).where(where).orderBy(...tableOrder(drive, q)).limit(q.perPage).offset((q.page - 1) * q.perPage),
  ])
  return { total: num(counted[0]?.n), page: q.page, perPage: q.perPage, items: rows.map(tidy) }
}

function tidy<T extends { nativeCoverAdded: unknown; lawnConverted: unknown }>(r: T) {
  return { ...r, nativeCoverAdded: Math.round(num(r.nativeCoverAdded) * 10) / 10, lawnConverted: Math.round(num(r.lawnConverted) * 10) / 10 }
}

export async function pledgeCsv(drive: DriveRow, q: PledgesQuery) {
  const rows = await useDb().select(tableColumns(drive)).from(pledges).where(tableFilter(drive, q)).orderBy(...tableOrder(drive, q)).limit(200_000)
  const header = ['reference', 'neighbourhood', 'status', 'pledged_on', `share_${drive.certifies}`, 'share_at_pledge', 'count_share', 'area_share', 'volume_share', 'native_cover_added_m2', 'lawn_converted_m2']
  const lines = rows.map((r0) => {
    const r = tidy(r0)
    return [r.reference, r.neighbourhood, r.status, r.pledgedOn, r.share, r.baseShare, r.countShare, r.areaShare, r.volumeShare, r.nativeCoverAdded, r.lawnConverted].map(csvCell).join(',')
  })
  return [header.join(','), ...lines].join('\r\n') + '\r\n'
}
