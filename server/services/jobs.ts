/**
 * Background jobs in MariaDB, safe with any number of app instances over one database.
 *
 * HOW TO ADD A JOB KIND (e.g. a pledge-drive reminder):
 * 1. Register a handler in a Nitro plugin of your own, e.g. server/plugins/pledge-jobs.ts:
 *      import { registerJobHandler } from '../services/jobs'
 *      export default defineNitroPlugin(() => {
 *        registerJobHandler<{ userId: number; driveId: number }>('pledge-reminder', async (payload, job) => {
 *          await sendMail({ to: …, subject: …, text: … })   // throw to retry later with backoff
 *        })
 *      })
 *    Only instances that registered a kind claim jobs of it, so a rolling deploy never fails a new kind.
 *    Throw `new JobCancelled('why')` when the job should not run after all (unsubscribed, plan changed): it is
 *    marked cancelled, not retried.
 * 2. Enqueue from a service or route (idempotent on the dedupe key; many rows at once in one transaction):
 *      await enqueueJob('pledge-reminder', { userId, driveId }, runAt, `pledge-reminder:${driveId}:${userId}`,
 *        { batchKey: `drive-${driveId}:reminder` })
 *      await enqueueJobs(users.map((u) => ({ kind: 'pledge-reminder', payload: {…}, runAt, dedupeKey: …, batchKey })))
 * 3. A progress bar polls `jobProgress(batchKey)` → { total, pending, claimed, sent, failed, cancelled, done }.
 * 4. server/plugins/jobs.ts runs `runDueJobs` every NUXT_JOBS_INTERVAL_MS (0 disables it in that instance).
 *
 * Delivery: a job is claimed by one instance at a time (SELECT … FOR UPDATE SKIP LOCKED in a short
 * transaction), its handler runs outside the transaction, then it is marked sent, or retried with
 * exponential backoff until max attempts and then failed. A claim older than `staleAfterMs` (the instance died
 * mid-handler) is claimable again, so a handler should tolerate the rare second run after a crash.
 */
import { and, eq, inArray, notInArray, sql } from 'drizzle-orm'
import { hostname } from 'node:os'
import { randomBytes } from 'node:crypto'
import { jobs, type JobRow, type JobStatus, JOB_STATUSES } from '../database/schema/jobs'
import { useDb, type Db } from '../utils/db'

export type JobHandler<P = Record<string, unknown>> = (payload: P, job: JobRow) => Promise<void>

export interface NewJob {
  kind: string
  payload: Record<string, unknown>
  runAt: Date
  dedupeKey: string
  batchKey?: string | null
  maxAttempts?: number
}

export interface EnqueueOptions {
  batchKey?: string | null
  maxAttempts?: number
  /** when the key exists and is still pending or cancelled: take the new payload and time and make it pending */
  reschedule?: boolean
  db?: Db
}

/** Thrown by a handler that decides the job no longer applies: marked cancelled with the reason, never retried. */
export class JobCancelled extends Error {}

const handlers = new Map<string, JobHandler<any>>()

/** This process's name in `claimed_by`. */
export const INSTANCE_ID = `${hostname()}-${process.pid}-${randomBytes(3).toString('hex')}`

export function registerJobHandler<P = Record<string, unknown>>(kind: string, handler: JobHandler<P>) {
  handlers.set(kind, handler as JobHandler<any>)
}

export function registeredJobKinds(): string[] {
  return [...handlers.keys()]
}

/** Backoff after the n-th failed attempt: 30 s, 1 min, 2 min … capped at one hour. */
export function retryDelayMs(attempt: number): number {
  return Math.min(30_000 * 2 ** Math.max(0, attempt - 1), 3_600_000)
}

function row(job: NewJob) {
  return {
    kind: job.kind,
    payload: job.payload,
    runAt: job.runAt,
    dedupeKey: job.dedupeKey,
    batchKey: job.batchKey ?? null,
    maxAttempts: job.maxAttempts ?? 5,
  }
}

// MySQL applies ODKU assignments left to right, so status is set last (the IFs read the old status).
const RESCHEDULE = {
  payload: sql`IF(status IN ('pending','cancelled'), VALUES(payload), payload)`,
  runAt: sql`IF(status IN ('pending','cancelled'), VALUES(run_at), run_at)`,
  batchKey: sql`IF(status IN ('pending','cancelled'), VALUES(batch_key), batch_key)`,
  status: sql`IF(status = 'cancelled', 'pending', status)`,
}

function checkKeys(job: NewJob) {
  // INSERT IGNORE would silently truncate an over-long key into someone else's: refuse it instead
  if (!job.kind || job.kind.length > 64) throw new Error(`job kind must be 1–64 characters: ${job.kind}`)
  if (!job.dedupeKey || job.dedupeKey.length > 191) throw new Error(`dedupe key must be 1–191 characters: ${job.dedupeKey}`)
  if (job.batchKey && job.batchKey.length > 128) throw new Error(`batch key must be at most 128 characters: ${job.batchKey}`)
  // a TIMESTAMP column ends in January 2038
  if (!(job.runAt instanceof Date) || !(job.runAt.getTime() > 0 && job.runAt.getTime() < 2_147_483_647_000)) throw new Error(`run_at is not a usable time: ${job.runAt}`)
}

/** Adds a job unless one with the same dedupe key exists. Returns true when a new row was written. */
export async function enqueueJob(kind: string, payload: Record<string, unknown>, runAt: Date, dedupeKey: string, options: EnqueueOptions = {}): Promise<boolean> {
  const added = await enqueueJobs([{ kind, payload, runAt, dedupeKey, batchKey: options.batchKey, maxAttempts: options.maxAttempts }], options)
  return added === 1
}

/** Many jobs in one transaction (chunks of 500 rows), idempotent on each dedupe key. Returns how many were new. */
export async function enqueueJobs(list: NewJob[], options: Omit<EnqueueOptions, 'batchKey' | 'maxAttempts'> = {}): Promise<number> {
  if (!list.length) return 0
  const db = options.db ?? useDb()
  let added = 0
  list.forEach(checkKeys)
  await db.transaction(async (tx) => {
    for (let i = 0; i < list.length; i += 500) {
      const chunk = list.slice(i, i + 500)
      if (options.reschedule) {
        const existing = await tx.select({ key: jobs.dedupeKey }).from(jobs).where(inArray(jobs.dedupeKey, chunk.map((j) => j.dedupeKey)))
        await tx.insert(jobs).values(chunk.map(row)).onDuplicateKeyUpdate({ set: RESCHEDULE })
        added += new Set(chunk.map((j) => j.dedupeKey)).size - existing.length
      } else {
        // keys were checked above, so IGNORE only ever skips a duplicate key; affectedRows counts new rows
        const [result] = await tx.insert(jobs).ignore().values(chunk.map(row))
        added += result.affectedRows
      }
    }
  })
  return added
}

/** Cancels jobs that have not been claimed yet, by batch and optionally keeping some dedupe keys. */
export async function cancelPendingJobs(batchKey: string, keepDedupeKeys: string[] = [], db: Db = useDb()): Promise<number> {
  const conditions = [eq(jobs.batchKey, batchKey), eq(jobs.status, 'pending')]
  if (keepDedupeKeys.length) conditions.push(notInArray(jobs.dedupeKey, keepDedupeKeys))
  const [result] = await db.update(jobs).set({ status: 'cancelled' }).where(and(...conditions))
  return result.affectedRows
}

export interface RunOptions {
  /** a claim older than this is treated as abandoned (its instance died) and claimed again */
  staleAfterMs?: number
  now?: () => Date
  db?: Db
  /** only these kinds (default: every kind with a handler in this process) */
  kinds?: string[]
}

export interface RunResult { claimed: number; sent: number; retried: number; failed: number; cancelled: number }

/**
 * Claims up to `limit` due jobs for `instanceId`, runs their handlers one after another and records the
 * outcome. Returns the counts; a full batch (`claimed === limit`) means more may be due.
 */
export async function runDueJobs(instanceId: string = INSTANCE_ID, limit = 50, options: RunOptions = {}): Promise<RunResult> {
  const db = options.db ?? useDb()
  const now = options.now ?? (() => new Date())
  const kinds = (options.kinds ?? registeredJobKinds()).filter((k) => handlers.has(k))
  const result: RunResult = { claimed: 0, sent: 0, retried: 0, failed: 0, cancelled: 0 }
  if (!kinds.length || limit <= 0) return result

  const claimTime = now()
  const staleBefore = new Date(claimTime.getTime() - (options.staleAfterMs ?? 10 * 60_000))
  // short transaction: lock due rows other instances have not locked, mark them ours, commit
  // Two index-ordered scans (status, run_at) and (status, claimed_at), so a LIMIT stops the scan early and
  // locks only the rows it returns; an OR or a filesort would lock every matching row and starve the others.
  const kindList = sql.join(kinds.map((k) => sql`${k}`), sql`, `)
  const claimed = await db.transaction(async (tx) => {
    const [due] = await tx.execute(sql`
      SELECT id FROM jobs FORCE INDEX (jobs_status_run_at_idx)
      WHERE status = 'pending' AND run_at <= ${claimTime} AND kind IN (${kindList})
      ORDER BY run_at, id LIMIT ${limit}
      FOR UPDATE SKIP LOCKED`) as unknown as [Array<{ id: number }>]
    let ids = due.map((r) => Number(r.id))
    if (ids.length < limit) {
      const [stale] = await tx.execute(sql`
        SELECT id FROM jobs FORCE INDEX (jobs_status_claimed_at_idx)
        WHERE status = 'claimed' AND claimed_at < ${staleBefore} AND kind IN (${kindList})
        ORDER BY claimed_at, id LIMIT ${limit - ids.length}
        FOR UPDATE SKIP LOCKED`) as unknown as [Array<{ id: number }>]
      ids = ids.concat(stale.map((r) => Number(r.id)))
    }
    if (!ids.length) return []
    await tx.update(jobs)
      .set({ status: 'claimed', claimedBy: instanceId, claimedAt: claimTime, attempts: sql`${jobs.attempts} + 1` })
      .where(inArray(jobs.id, ids))
    return tx.select().from(jobs).where(inArray(jobs.id, ids)).orderBy(jobs.runAt, jobs.id)
  }, { isolationLevel: 'read committed' })

  result.claimed = claimed.length
  for (const job of claimed) {
    // the row is ours only while claimed_by and attempts still match (a stale re-claim bumps attempts)
    const stillOurs = and(eq(jobs.id, job.id), eq(jobs.status, 'claimed'), eq(jobs.claimedBy, instanceId), eq(jobs.attempts, job.attempts))
    try {
      await handlers.get(job.kind)!(job.payload, job)
      await db.update(jobs).set({ status: 'sent', sentAt: now(), lastError: null }).where(stillOurs)
      result.sent++
    } catch (e) {
      const message = String((e as Error)?.message ?? e).slice(0, 2000)
      if (e instanceof JobCancelled) {
        await db.update(jobs).set({ status: 'cancelled', lastError: message }).where(stillOurs)
        result.cancelled++
      } else if (job.attempts >= job.maxAttempts) {
        await db.update(jobs).set({ status: 'failed', lastError: message }).where(stillOurs)
        result.failed++
      } else {
        await db.update(jobs).set({ status: 'pending', lastError: message, claimedBy: null, claimedAt: null, runAt: new Date(now().getTime() + retryDelayMs(job.attempts)) }).where(stillOurs)
        result.retried++
      }
    }
  }
  return result
}

export type JobProgress = Record<JobStatus, number> & { total: number; done: number }

/** Counts by status for one batch, for a progress bar to poll; `done` is sent + failed + cancelled. */
export async function jobProgress(batchKey: string, db: Db = useDb()): Promise<JobProgress> {
  const rows = await db.select({ status: jobs.status, n: sql<number>`COUNT(*)` }).from(jobs)
    .where(eq(jobs.batchKey, batchKey)).groupBy(jobs.status)
  const out = Object.fromEntries(JOB_STATUSES.map((s) => [s, 0])) as JobProgress
  for (const r of rows) out[r.status] = Number(r.n)
  out.total = JOB_STATUSES.reduce((n, s) => n + out[s], 0)
  out.done = out.sent + out.failed + out.cancelled
  return out
}
