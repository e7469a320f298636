// Smaller leaks: what a calendar file, a CSV export and a search may be made to say, and what the reset form's
// timing could tell.
import { describe, it, expect, afterAll } from 'vitest'
import mysql from 'mysql2/promise'
import { drizzle } from 'drizzle-orm/mysql2'
import { Client, newHomeowner, demo } from '../../support/http'
import { yardWith } from '../advice/fixtures'
import * as schema from '../../../server/database/schema'
import { yardListQuery } from '../../../server/services/yard-list'

const pool = mysql.createPool({ uri: process.env.DATABASE_URL!, connectionLimit: 2 })
afterAll(() => pool.end())

describe('smaller leaks', () => {
  it('a CR/LF in a yard name cannot add lines to the seed calendar', async () => {
    const { client } = await newHomeowner('ics')
    const yardId = await yardWith(client, { name: 'Front\r\nBEGIN:VEVENT\r\nSUMMARY:Injected' })
    const r = await client.get(`/api/yards/${yardId}/seed-plan.ics`)
    expect(r.status).toBe(200)
    const lines = String(r.body).split(/\r\n/)
    expect(lines).not.toContain('SUMMARY:Injected')
    expect(lines.filter((l) => l === 'BEGIN:VEVENT').length).toBe(lines.filter((l) => l === 'END:VEVENT').length)
  })

  it('a leading - = + @ in a field reaches the CSV export as text, not a formula', async () => {
    const { client } = await newHomeowner('csv')
    const yardId = await yardWith(client, { allNative: true })
    const neighbourhood = `-1+1|cmd ${process.pid}`
    expect([200, 201]).toContain((await client.post(`/api/yards/${yardId}/pledge`, { neighbourhood, consent: true })).status)
    const csv = String((await (await demo('coordinator')).get('/api/drives/current/pledges.csv?perPage=200')).body)
    // OWASP "CSV Injection": a cell that starts with one of these characters is prefixed with an apostrophe
    expect(csv).toContain(`'${neighbourhood}`)
    expect(csv.split(/\r\n/).some((line) => line.split(',').some((cell) => /^[=+\-@]/.test(cell)))).toBe(false)
  })

  it('% and _ in a user search are matched literally', async () => {
    const coordinator = await demo('coordinator')
    const all = await coordinator.get('/api/users?q=')
    const pct = await coordinator.get('/api/users?q=%25')
    const under = await coordinator.get('/api/users?q=_')
    expect(all.body.total).toBeGreaterThan(1)
    for (const r of [pct, under]) {
      expect(r.status).toBe(200)
      for (const u of r.body.items as Array<{ email: string; name: string }>) expect(`${u.email}${u.name}`).toMatch(/[%_]/)
    }
  })

  it('a forgotten-password request does the same work for a known and an unknown e-mail (one queued job)', async () => {
    const { email } = await newHomeowner('forgot')
    const unknown = `nobody-${Date.now()}@example.test`
    for (const e of [email, unknown]) expect((await new Client().post('/api/auth/forgot-password', { email: e })).status).toBe(200)
    const [rows] = await pool.query<mysql.RowDataPacket[]>("select json_unquote(json_extract(payload, '$.email')) as email from jobs where kind = 'password-reset' and json_unquote(json_extract(payload, '$.email')) in (?, ?)", [email, unknown])
    expect(rows.map((r) => r.email).sort()).toEqual([email, unknown].sort())
  })

  it("the yard list reads the user's yards by index, never the whole table", async () => {
    const db = drizzle(pool, { schema, mode: 'default' })
    const { sql, params } = yardListQuery(db, 1).toSQL()
    const [plan] = await pool.query<mysql.RowDataPacket[]>(`explain ${sql}`, params)
    // EXPLAIN's "type: ALL" is a full scan (MariaDB knowledge base, "EXPLAIN"); only the UNION's own result may have it
    const scans = plan.filter((row) => row.type === 'ALL' && row.table && !String(row.table).startsWith('<union'))
    expect(scans).toEqual([])
  })
})
