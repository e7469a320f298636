// The shared job table against the real MariaDB: two schedulers (separate connection pools, as two app
// instances would have) over the same rows send each job exactly once; retries, stale claims, progress.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import mysql from 'mysql2/promise'
import { drizzle } from 'drizzle-orm/mysql2'
import { eq, like } from 'drizzle-orm'
import * as schema from '../../../server/database/schema'
import { enqueueJob, enqueueJobs, registerJobHandler, runDueJobs, jobProgress, cancelPendingJobs, retryDelayMs, JobCancelled } from '../../../server/services/jobs'
import type { Db } from '../../../server/utils/db'

const pools: mysql.Pool[] = []
function instanceDb(): Db {
  const pool = mysql.createPool({ uri: process.env.DATABASE_URL!, connectionLimit: 5, timezone: 'Z' })
  pools.push(pool)
  return drizzle(pool, { schema, mode: 'default' }) as Db
}

// kinds unique to this run, so the running test server (which has no handler for them) never claims them
const tag = `${process.pid}-${Date.now()}`
let a: Db
let b: Db
beforeAll(() => { a = instanceDb(); b = instanceDb() })
afterAll(async () => { await Promise.all(pools.map((p) => p.end())) })

// like the plugin's loop: run batches until nothing of the kind is left pending or claimed
async function drain(db: Db, instance: string, kind: string, batchKey: string) {
  for (;;) {
    const r = await runDueJobs(instance, 7, { db, kinds: [kind] })
    if (r.claimed > 0) continue
    const p = await jobProgress(batchKey, db)
    if (p.pending + p.claimed === 0) return
    await new Promise((res) => setTimeout(res, 5))
  }
}

describe('job table', () => {
  it('two schedulers over the same jobs handle each job exactly once', async () => {
    const kind = `test-once-${tag}`
    const handled: number[] = []
    const byInstance = new Map<string, number>()
    registerJobHandler<{ n: number }>(kind, async (payload, job) => {
      handled.push(payload.n)
      byInstance.set(job.claimedBy!, (byInstance.get(job.claimedBy!) ?? 0) + 1)
      // widen the window in which the other scheduler could grab the same row
      await new Promise((r) => setTimeout(r, 2))
    })
    const past = new Date(Date.now() - 1000)
    const added = await enqueueJobs(Array.from({ length: 150 }, (_, n) => ({ kind, payload: { n }, runAt: past, dedupeKey: `${kind}:${n}`, batchKey: `${kind}:batch` })), { db: a })
    expect(added).toBe(150)

    await Promise.all([drain(a, 'instance-a', kind, `${kind}:batch`), drain(b, 'instance-b', kind, `${kind}:batch`)])

    expect(handled.length).toBe(150)
    expect(new Set(handled).size).toBe(150)
    // both really took part (otherwise the test proves nothing about concurrency)
    expect(byInstance.get('instance-a')).toBeGreaterThan(0)
    expect(byInstance.get('instance-b')).toBeGreaterThan(0)
    const progress = await jobProgress(`${kind}:batch`, a)
    expect(progress).toMatchObject({ total: 150, sent: 150, pending: 0, claimed: 0, failed: 0, done: 150 })
  })

  it('enqueueing is idempotent on the dedupe key, single and bulk', async () => {
    const kind = `test-dedupe-${tag}`
    const at = new Date(Date.now() + 86_400_000)
    expect(await enqueueJob(kind, { v: 1 }, at, `${kind}:x`, { db: a })).toBe(true)
    expect(await enqueueJob(kind, { v: 2 }, at, `${kind}:x`, { db: b })).toBe(false)
    expect(await enqueueJobs([
      { kind, payload: { v: 3 }, runAt: at, dedupeKey: `${kind}:x` },
      { kind, payload: { v: 4 }, runAt: at, dedupeKey: `${kind}:y` },
    ], { db: a })).toBe(1)
    const rows = await a.select().from(schema.jobs).where(like(schema.jobs.dedupeKey, `${kind}:%`))
    expect(rows.length).toBe(2)
    expect(rows.find((r) => r.dedupeKey === `${kind}:x`)!.payload).toEqual({ v: 1 })
  })

  it('a failing handler is retried with backoff, then marked failed', async () => {
    const kind = `test-retry-${tag}`
    let calls = 0
    registerJobHandler(kind, async () => { calls++; throw new Error('smtp down') })
    const start = Date.now()
    await enqueueJob(kind, {}, new Date(start - 1000), `${kind}:1`, { db: a, maxAttempts: 2 })

    const first = await runDueJobs('instance-a', 10, { db: a, kinds: [kind], now: () => new Date(start) })
    expect(first).toMatchObject({ claimed: 1, retried: 1 })
    const [afterOne] = await a.select().from(schema.jobs).where(eq(schema.jobs.dedupeKey, `${kind}:1`))
    expect(afterOne!.status).toBe('pending')
    expect(afterOne!.lastError).toBe('smtp down')
    expect(afterOne!.runAt.getTime()).toBe(start + retryDelayMs(1))

    // not due again before the backoff has passed
    expect((await runDueJobs('instance-b', 10, { db: b, kinds: [kind], now: () => new Date(start + 1000) })).claimed).toBe(0)
    const second = await runDueJobs('instance-b', 10, { db: b, kinds: [kind], now: () => new Date(start + retryDelayMs(1) + 1) })
    expect(second).toMatchObject({ claimed: 1, failed: 1 })
    const [afterTwo] = await a.select().from(schema.jobs).where(eq(schema.jobs.dedupeKey, `${kind}:1`))
    expect(afterTwo!.status).toBe('failed')
    expect(afterTwo!.attempts).toBe(2)
    expect(calls).toBe(2)
  })

  it('a claim that went stale (its instance died) is claimed again; a fresh one is not', async () => {
    const kind = `test-stale-${tag}`
    const handledBy: string[] = []
    registerJobHandler(kind, async (_p, job) => { handledBy.push(job.claimedBy!) })
    const start = Date.now()
    await enqueueJob(kind, {}, new Date(start - 1000), `${kind}:1`, { db: a })
    // instance a claims the row and "dies" before finishing
    await a.update(schema.jobs).set({ status: 'claimed', claimedBy: 'dead-instance', claimedAt: new Date(start), attempts: 1 }).where(eq(schema.jobs.dedupeKey, `${kind}:1`))

    expect((await runDueJobs('instance-b', 10, { db: b, kinds: [kind], staleAfterMs: 60_000, now: () => new Date(start + 30_000) })).claimed).toBe(0)
    const r = await runDueJobs('instance-b', 10, { db: b, kinds: [kind], staleAfterMs: 60_000, now: () => new Date(start + 61_000) })
    expect(r).toMatchObject({ claimed: 1, sent: 1 })
    expect(handledBy).toEqual(['instance-b'])
    const [done] = await a.select().from(schema.jobs).where(eq(schema.jobs.dedupeKey, `${kind}:1`))
    expect(done!.status).toBe('sent')
    expect(done!.attempts).toBe(2)
  })

  it('cancels pending jobs of a batch and reschedules a cancelled key when asked', async () => {
    const kind = `test-cancel-${tag}`
    const batchKey = `${kind}:b`
    const at = new Date(Date.now() + 3_600_000)
    await enqueueJobs([1, 2, 3].map((n) => ({ kind, payload: { n }, runAt: at, dedupeKey: `${kind}:${n}`, batchKey })), { db: a })
    expect(await cancelPendingJobs(batchKey, [`${kind}:3`], a)).toBe(2)
    expect(await jobProgress(batchKey, a)).toMatchObject({ total: 3, pending: 1, cancelled: 2 })
    const later = new Date(at.getTime() + 60_000)
    await enqueueJob(kind, { n: 1, again: true }, later, `${kind}:1`, { db: a, batchKey, reschedule: true })
    const [row] = await a.select().from(schema.jobs).where(eq(schema.jobs.dedupeKey, `${kind}:1`))
    expect(row!.status).toBe('pending')
    expect(row!.payload).toEqual({ n: 1, again: true })
    expect(row!.runAt.getTime()).toBe(later.getTime())
  })

  it('a handler that cancels its job marks it cancelled, without retrying', async () => {
    const kind = `test-cancelled-${tag}`
    let calls = 0
    registerJobHandler(kind, async () => { calls++; throw new JobCancelled('unsubscribed') })
    await enqueueJob(kind, {}, new Date(Date.now() - 1000), `${kind}:1`, { db: a })
    expect(await runDueJobs('instance-a', 10, { db: a, kinds: [kind] })).toMatchObject({ claimed: 1, cancelled: 1 })
    expect(await runDueJobs('instance-a', 10, { db: a, kinds: [kind], now: () => new Date(Date.now() + 86_400_000) })).toMatchObject({ claimed: 0 })
    const [row] = await a.select().from(schema.jobs).where(eq(schema.jobs.dedupeKey, `${kind}:1`))
    expect(row).toMatchObject({ status: 'cancelled', lastError: 'unsubscribed' })
    expect(calls).toBe(1)
  })
})
