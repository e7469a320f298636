// Pledge drives: the running drive, pledging a yard, keeping each pledged yard's shares current (and one
// snapshot per yard per day) after every save, verification by an advisor, the certificate and bulk mail.
import { and, eq, gte, lte, desc, inArray, sql } from 'drizzle-orm'
import { drives, pledges, shareSnapshots, driveMailings, driveMailDeliveries, driveSummaries, yards, users, organisation, type DriveRow, type PledgeRow } from '../database/schema'
import type { YardDocument } from '#shared/schemas/yard-document'
import type { ShareSet } from '#shared/schemas/advice'
import type { AccountRow, YardRow } from '../database/schema'
import { GOAL_TOLERANCE, meetsGoal } from '#shared/utils/score'
import { yardFacts } from './scoring'
import { sharesInWorker } from './score-pool'
import { enqueueJobs, jobProgress } from './jobs'

export type ShareKind = 'count' | 'area' | 'volume'
export const DRIVE_MAIL_JOB = 'drive-mail'
// the database or a transaction on it: writes that go together take the transaction
type DbOrTx = Db | Parameters<Parameters<Db['transaction']>[0]>[0]

export const today = () => new Date().toISOString().slice(0, 10)

/** Marks a drive's cached dashboard summary out of date; every change to its pledges or settings calls this. */
export async function bumpDriveVersion(driveId: number, db: DbOrTx = useDb()) {
  await db.insert(driveSummaries).values({ driveId, version: 1 }).onDuplicateKeyUpdate({ set: { version: sql`${driveSummaries.version} + 1` } })
}

/** The shares of a document as the score engine gives them, plus the visible lawn area (m²). */
export async function yardShares(doc: YardDocument, region: string): Promise<{ shares: ShareSet; lawnArea: number }> {
  return sharesInWorker({ doc, facts: await yardFacts(doc, region), region })
}

/** The share columns kept on a pledge and a snapshot (a share with nothing to share is stored as 0). */
function shareColumns({ shares, lawnArea }: { shares: ShareSet; lawnArea: number }) {
  return {
    countNative: shares.count.native, countTotal: shares.count.total, countShare: shares.count.share ?? 0,
    areaNative: shares.area.native, areaTotal: shares.area.total, areaShare: shares.area.share ?? 0,
    volumeNative: shares.volume.native, volumeTotal: shares.volume.total, volumeShare: shares.volume.share ?? 0,
    lawnArea,
  }
}

export const shareColumn = (kind: ShareKind) => (kind === 'count' ? pledges.countShare : kind === 'area' ? pledges.areaShare : pledges.volumeShare)

function statusFor(drive: DriveRow, current: PledgeRow['status'] | null, cols: ReturnType<typeof shareColumns>): PledgeRow['status'] {
  if (current === 'verified') return 'verified'
  const share = drive.certifies === 'count' ? cols.countShare : drive.certifies === 'area' ? cols.areaShare : cols.volumeShare
  return meetsGoal(share, Number(drive.goal)) ? 'reached' : 'pledged'
}

export async function runningDrive(): Promise<DriveRow | null> {
  const d = today()
  const [row] = await useDb().select().from(drives).where(and(lte(drives.startsOn, d), gte(drives.endsOn, d))).orderBy(desc(drives.startsOn), desc(drives.id)).limit(1)
  return row ?? null
}

/** `current` or an id → the drive, 404 when there is none. */
export async function requireDrive(id: number | 'current'): Promise<DriveRow> {
  const drive = id === 'current' ? await runningDrive() : (await useDb().select().from(drives).where(eq(drives.id, id)).limit(1))[0]
  if (!drive) throw createError({ status: 404, message: id === 'current' ? 'No pledge drive is running' : 'No such drive' })
  return drive
}

export function driveView(d: DriveRow) {
  return { id: d.id, name: d.name, startsOn: d.startsOn, endsOn: d.endsOn, goal: Number(d.goal), certifies: d.certifies, target: d.target }
}

type DriveInput = { name: string; startsOn: string; endsOn: string; goal: number; certifies: ShareKind; target: number }

async function assertNoOverlap(input: DriveInput, exceptId?: number) {
  const rows = await useDb().select({ id: drives.id, name: drives.name }).from(drives)
    .where(and(lte(drives.startsOn, input.endsOn), gte(drives.endsOn, input.startsOn)))
  const clash = rows.find((r) => r.id !== exceptId)
  if (clash) throw createError({ status: 409, message: `Those dates overlap the drive “${clash.name}”: one drive runs at a time`, data: { fields: { startsOn: 'Overlaps another drive' } } })
}

export async function createDrive(user: AccountRow, input: DriveInput) {
  await assertNoOverlap(input)
  const id = insertedId(await useDb().insert(drives).values({ ...input, createdBy: user.id }).$returningId())
  return driveView(await requireDrive(id))
}

/** Saves a drive; a new goal or certifying share re-derives every pledge's status, all in one transaction. */
export async function updateDrive(id: number, input: DriveInput) {
  await requireDrive(id)
  await assertNoOverlap(input, id)
  const col = shareColumn(input.certifies)
  await useDb().transaction(async (tx) => {
    await tx.update(drives).set(input).where(eq(drives.id, id))
    await tx.update(pledges).set({
      status: sql`CASE WHEN ${pledges.status} = 'verified' THEN 'verified' WHEN ${col} >= ${input.goal - GOAL_TOLERANCE} THEN 'reached' ELSE 'pledged' END`,
    }).where(eq(pledges.driveId, id))
    await bumpDriveVersion(id, tx)
  })
  return driveView(await requireDrive(id))
}

export async function listDrives() {
  const rows = await useDb().select().from(drives).orderBy(desc(drives.startsOn))
  const running = await runningDrive()
  return rows.map((d) => ({ ...driveView(d), running: running?.id === d.id }))
}

function pledgeView(p: PledgeRow, drive: DriveRow) {
  const share = drive.certifies === 'count' ? p.countShare : drive.certifies === 'area' ? p.areaShare : p.volumeShare
  return {
    id: p.id, driveId: p.driveId, yardId: p.yardId, neighbourhood: p.neighbourhood, consent: p.consent, status: p.status,
    pledgedOn: p.pledgedOn, share, baseShare: p.baseShare, verifiedAt: p.verifiedAt,
    shares: { count: p.countShare, area: p.areaShare, volume: p.volumeShare },
  }
}

/** The running drive and this yard's pledge to it, for the pledge form. */
export async function yardPledgeState(yardId: number) {
  const drive = await runningDrive()
  if (!drive) return { drive: null, pledge: null }
  const [p] = await useDb().select().from(pledges).where(and(eq(pledges.yardId, yardId), eq(pledges.driveId, drive.id))).limit(1)
  return { drive: driveView(drive), pledge: p ? pledgeView(p, drive) : null }
}

/** Pledges a yard to the running drive, or updates the neighbourhood and consent of its pledge. */
export async function pledgeYard(owner: AccountRow, yard: YardRow, input: { neighbourhood: string; consent: boolean }) {
  const drive = await runningDrive()
  if (!drive) throw createError({ status: 409, message: 'No pledge drive is running just now' })
  const cols = shareColumns(await yardShares(yard.document, yard.region))
  // the pledge, the day's snapshot and the drive's version change together; the pledge row is locked while read.
  // Two first pledges at once: the unique key (yard, drive) lets one insert land; the other updates (or, chosen
  // as a deadlock victim on the gap lock, runs again and finds the row)
  const { created, p } = await withContentionRetry(() => useDb().transaction(async (tx) => {
    const [existing] = await tx.select().from(pledges).where(and(eq(pledges.yardId, yard.id), eq(pledges.driveId, drive.id))).limit(1).for('update')
    const status = statusFor(drive, existing?.status ?? null, cols)
    let created = false
    if (existing) {
      await tx.update(pledges).set({ ...input, ...cols, status }).where(eq(pledges.id, existing.id))
    } else {
      const base = drive.certifies === 'count' ? cols.countShare : drive.certifies === 'area' ? cols.areaShare : cols.volumeShare
      created = await tx.insert(pledges).values({
        driveId: drive.id, yardId: yard.id, userId: owner.id, ...input, pledgedOn: today(), ...cols, status,
        baseAreaNative: cols.areaNative, baseLawnArea: cols.lawnArea, baseShare: base, reachedAt: status === 'reached' ? new Date() : null,
      }).then(() => true, (e) => { if (!isDuplicateKey(e)) throw e; return false })
      if (!created) await tx.update(pledges).set(input).where(and(eq(pledges.yardId, yard.id), eq(pledges.driveId, drive.id)))
    }
    await upsertSnapshot(yard.id, cols, today(), tx)
    await bumpDriveVersion(drive.id, tx)
    const [p] = await tx.select().from(pledges).where(and(eq(pledges.yardId, yard.id), eq(pledges.driveId, drive.id))).limit(1)
    return { created, p }
  }))
  return { created, drive: driveView(drive), pledge: pledgeView(p!, drive) }
}

export async function withdrawPledge(yardId: number) {
  const drive = await requireDrive('current')
  await useDb().transaction(async (tx) => {
    const [r] = await tx.delete(pledges).where(and(eq(pledges.yardId, yardId), eq(pledges.driveId, drive.id)))
    if (r.affectedRows === 0) throw createError({ status: 404, message: 'This yard is not pledged to the running drive' })
    await bumpDriveVersion(drive.id, tx)
  })
}

async function upsertSnapshot(yardId: number, cols: ReturnType<typeof shareColumns>, day = today(), db: DbOrTx = useDb()) {
  // one row per yard per day: the day's last save wins
  await db.insert(shareSnapshots).values({ yardId, day, ...cols }).onDuplicateKeyUpdate({ set: cols })
}

/**
 * After a save: when the yard is pledged to a drive that has not ended, refresh its pledges' shares and status
 * and the day's snapshot. A yard that is not pledged costs one indexed lookup.
 */
export async function recordPledgedShares(yard: YardRow) {
  const db = useDb()
  const rows = await db.select({ pledge: pledges, drive: drives }).from(pledges).innerJoin(drives, eq(drives.id, pledges.driveId))
    .where(and(eq(pledges.yardId, yard.id), gte(drives.endsOn, today())))
  if (!rows.length) return
  const cols = shareColumns(await yardShares(yard.document, yard.region))
  await db.transaction(async (tx) => {
    for (const { pledge, drive } of rows) {
      const status = statusFor(drive, pledge.status, cols)
      await tx.update(pledges).set({ ...cols, status, reachedAt: status === 'reached' && !pledge.reachedAt ? new Date() : pledge.reachedAt }).where(eq(pledges.id, pledge.id))
      await bumpDriveVersion(drive.id, tx)
    }
    await upsertSnapshot(yard.id, cols, today(), tx)
  })
}

/** An advisor on a visit confirms the running drive's pledge of a yard that has reached the goal. */
export async function verifyPledge(advisor: AccountRow, yardId: number) {
  const drive = await requireDrive('current')
  const db = useDb()
  const [p] = await db.select().from(pledges).where(and(eq(pledges.yardId, yardId), eq(pledges.driveId, drive.id))).limit(1)
  if (!p) throw createError({ status: 404, message: 'This yard is not pledged to the running drive' })
  if (p.status === 'pledged') throw createError({ status: 409, message: `The yard has not reached the goal by ${drive.certifies} yet, so it cannot be verified` })
  if (p.status !== 'verified') {
    await db.transaction(async (tx) => {
      await tx.update(pledges).set({ status: 'verified', verifiedAt: new Date(), verifiedBy: advisor.id }).where(eq(pledges.id, p.id))
      await bumpDriveVersion(drive.id, tx)
    })
  }
  const [fresh] = await db.select().from(pledges).where(eq(pledges.id, p.id))
  return pledgeView(fresh!, drive)
}

/** What a printable certificate shows; only for a verified pledge. */
export async function certificate(yard: YardRow) {
  const db = useDb()
  const [row] = await db.select({ pledge: pledges, drive: drives }).from(pledges).innerJoin(drives, eq(drives.id, pledges.driveId))
    .where(and(eq(pledges.yardId, yard.id), eq(pledges.status, 'verified'))).orderBy(desc(pledges.verifiedAt)).limit(1)
  if (!row) throw createError({ status: 404, message: 'This yard has no verified pledge yet' })
  const [[owner], [verifier], [org]] = await Promise.all([
    db.select({ name: users.name }).from(users).where(eq(users.id, yard.ownerId)),
    row.pledge.verifiedBy ? db.select({ name: users.name }).from(users).where(eq(users.id, row.pledge.verifiedBy)) : Promise.resolve([]),
    db.select({ name: organisation.name }).from(organisation).limit(1),
  ])
  const view = pledgeView(row.pledge, row.drive)
  return {
    yardName: yard.name, household: owner?.name ?? '', drive: driveView(row.drive), organisation: org?.name ?? '',
    share: view.share, shares: view.shares, verifiedAt: row.pledge.verifiedAt, verifiedBy: (verifier as { name: string } | undefined)?.name ?? null,
  }
}

const AUDIENCE_STATUSES = { all: ['pledged', 'reached', 'verified'], pledged: ['pledged'], reached: ['reached'], verified: ['verified'] } as const

/** A bulk mail to the drive's pledgers: one job per pledge in the shared job table, grouped by the mailing. */
export async function createMailing(user: AccountRow, drive: DriveRow, input: { kind: 'reminder' | 'thanks'; audience: keyof typeof AUDIENCE_STATUSES; subject: string; body: string }) {
  const db = useDb()
  const batch = `drive-${drive.id}:mail-${Date.now()}-${Math.random().toString(36).slice(2, 8)}`
  const mailingId = insertedId(await db.insert(driveMailings).values({ driveId: drive.id, ...input, batch, createdBy: user.id }).$returningId())
  const recipients = await db.select({ id: pledges.id }).from(pledges)
    .where(and(eq(pledges.driveId, drive.id), inArray(pledges.status, [...AUDIENCE_STATUSES[input.audience]])))
  const runAt = new Date()
  await enqueueJobs(recipients.map((r) => ({ kind: DRIVE_MAIL_JOB, payload: { mailingId, pledgeId: r.id }, runAt, dedupeKey: `drive-mail:${mailingId}:${r.id}`, batchKey: batch })))
  await db.update(driveMailings).set({ recipients: recipients.length }).where(eq(driveMailings.id, mailingId))
  return mailingView(drive, mailingId)
}

export async function mailingView(drive: DriveRow, mailingId: number) {
  const [m] = await useDb().select().from(driveMailings).where(and(eq(driveMailings.id, mailingId), eq(driveMailings.driveId, drive.id))).limit(1)
  if (!m) throw createError({ status: 404, message: 'No such mailing' })
  const progress = await jobProgress(m.batch)
  return { id: m.id, kind: m.kind, audience: m.audience, subject: m.subject, recipients: m.recipients, createdAt: m.createdAt, progress }
}

export async function listMailings(drive: DriveRow) {
  const rows = await useDb().select({ id: driveMailings.id }).from(driveMailings).where(eq(driveMailings.driveId, drive.id)).orderBy(desc(driveMailings.id)).limit(20)
  return Promise.all(rows.map((r) => mailingView(drive, r.id)))
}

/** The job handler: one mail to one pledger; the delivery row makes a doubled or retried job a no-op. */
export async function sendDriveMail(payload: { mailingId: number; pledgeId: number }) {
  const db = useDb()
  const [row] = await db.select({ mailing: driveMailings, pledge: pledges, drive: drives, email: users.email, name: users.name, yardName: yards.name })
    .from(driveMailings).innerJoin(drives, eq(drives.id, driveMailings.driveId))
    .innerJoin(pledges, eq(pledges.id, payload.pledgeId)).innerJoin(users, eq(users.id, pledges.userId)).innerJoin(yards, eq(yards.id, pledges.yardId))
    .where(eq(driveMailings.id, payload.mailingId)).limit(1)
  if (!row) return
  const [claim] = await db.insert(driveMailDeliveries).ignore().values({ mailingId: payload.mailingId, pledgeId: payload.pledgeId })
  if (claim.affectedRows === 0) return
  const view = pledgeView(row.pledge, row.drive)
  const pct = (x: number) => `${Math.round(x * 100)} %`
  try {
    await sendMail({
      to: row.email,
      subject: row.mailing.subject,
      text: `Hello ${row.name},\n\n${row.mailing.body}\n\n`
        + `Your yard "${row.yardName}" is at ${pct(view.share)} native by ${row.drive.certifies} (the drive's goal is ${pct(Number(row.drive.goal))}); status: ${row.pledge.status}.\n`
        + `${appLink(`/yards/${row.pledge.yardId}`)}\n`,
      headers: { 'X-Wildward-Mailing': String(payload.mailingId) },
    })
  } catch (e) {
    // not sent: let the job's retry try again
    await db.delete(driveMailDeliveries).where(and(eq(driveMailDeliveries.mailingId, payload.mailingId), eq(driveMailDeliveries.pledgeId, payload.pledgeId)))
    throw e
  }
}
