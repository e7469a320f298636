// Sessions end on the server: sign-out, a password change or reset, inactivity and age each end them, and a
// cookie copied before that no longer works.
import { describe, it, expect, afterAll } from 'vitest'
import { spawn } from 'node:child_process'
import { createServer } from 'node:net'
import mysql from 'mysql2/promise'
import { Client, newHomeowner, waitForMail } from '../../support/http'
import { sessionCookieEnv } from '../../../scripts/lib/services.mjs'

const pool = mysql.createPool({ uri: process.env.DATABASE_URL!, connectionLimit: 2 })
afterAll(() => pool.end())

/** A second client holding exactly the same cookies (a stolen or copied cookie). */
function copyOf(c: Client): Client {
  const copy = new Client()
  ;(copy as unknown as { cookies: Map<string, string> }).cookies = new Map((c as unknown as { cookies: Map<string, string> }).cookies)
  return copy
}

describe('sessions', () => {
  it('a cookie copied before sign-out stops working after it', async () => {
    const { client } = await newHomeowner('logout')
    const copy = copyOf(client)
    expect((await copy.get('/api/auth/me')).status).toBe(200)
    expect((await client.post('/api/auth/logout')).status).toBe(200)
    expect((await copy.get('/api/auth/me')).status).toBe(401)
    // the client's own session probe says signed out too
    expect((await copy.get('/api/_auth/session')).body?.user).toBeUndefined()
  })

  it('a password change ends the other sessions and keeps the one that made it', async () => {
    const { client, email } = await newHomeowner('change-ends')
    const elsewhere = new Client()
    await elsewhere.login(email, 'a-long-test-password')
    expect((await client.put('/api/auth/password', { currentPassword: 'a-long-test-password', newPassword: 'a-second-long-password' })).status).toBe(200)
    expect((await elsewhere.get('/api/auth/me')).status).toBe(401)
    expect((await client.get('/api/auth/me')).status).toBe(200)
  })

  it('a password reset ends every session of the account', async () => {
    const { client, email } = await newHomeowner('reset-ends')
    expect((await new Client().post('/api/auth/forgot-password', { email })).status).toBe(200)
    const [mail] = await waitForMail(email, 1, 15_000)
    const token = decodeURIComponent(/token=([^\s]+)/.exec(mail!.text)![1]!)
    const resetter = new Client()
    expect((await resetter.post('/api/auth/reset-password', { token, password: 'a-brand-new-password' })).status).toBe(200)
    expect((await client.get('/api/auth/me')).status).toBe(401)
    expect((await resetter.get('/api/auth/me')).status).toBe(200)
  })

  it('ends after a period without use, and after its absolute age even when used', async () => {
    const idle = await newHomeowner('idle')
    const old = await newHomeowner('old')
    // age the rows as the clock would (the defaults: 3 days idle, 14 days in all; nuxt.config.ts)
    await pool.query('update sessions set last_seen_at = now(3) - interval 4 day where user_id = ?', [idle.user.id])
    await pool.query('update sessions set created_at = now(3) - interval 15 day, last_seen_at = now(3) where user_id = ?', [old.user.id])
    expect((await idle.client.get('/api/auth/me')).status).toBe(401)
    expect((await old.client.get('/api/auth/me')).status).toBe(401)
  })

  it('names its cookie __Host- and marks it Secure where the app is served over HTTPS', { timeout: 90_000 }, async () => {
    const port = await new Promise<number>((res) => { const s = createServer(); s.listen(0, '127.0.0.1', () => { const p = (s.address() as { port: number }).port; s.close(() => res(p)) }) })
    const child = spawn(process.execPath, [process.env.WW_SERVER_ENTRY!], {
      env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_APP_URL: 'https://wildward.example.test', ...sessionCookieEnv('https://wildward.example.test'), NUXT_JOBS_INTERVAL_MS: '0' },
      stdio: 'ignore',
    })
    try {
      const { email } = await newHomeowner('host-prefix')
      let r: Response | undefined
      for (let i = 0; i < 600 && !r; i++) {
        try {
          r = await fetch(`http://127.0.0.1:${port}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password: 'a-long-test-password' }) })
        } catch { await new Promise((s) => setTimeout(s, 100)) }
      }
      expect(r!.status).toBe(200)
      const cookie = r!.headers.getSetCookie().find((c) => c.includes('session='))!
      expect(cookie).toMatch(/^__Host-/)
      expect(cookie).toMatch(/;\s*Secure/i)
      expect(cookie).toMatch(/;\s*Path=\//i)
      expect(cookie).not.toMatch(/Domain=/i)
    } finally {
      child.kill()
    }
  })
})
