// Demo mode: a banner on every page, refused away from loopback unless asked for, and the captured-mail page
// never shows another account's live reset link.
import { describe, it, expect } from 'vitest'
import { spawn } from 'node:child_process'
import { Client, demo, newHomeowner, waitForMail } from '../../support/http'

describe('demo mode', () => {
  it('shows a banner on every page', async () => {
    for (const path of ['/', '/login', '/no-such-page']) {
      const r = await new Client().request('GET', path, undefined, { accept: 'text/html' })
      expect(String(r.body)).toContain('data-testid="demo-banner"')
    }
  })

  it('refuses to start on a non-loopback address unless asked for explicitly', { timeout: 60_000 }, async () => {
    const child = spawn(process.execPath, [process.env.WW_SERVER_ENTRY!], {
      env: { ...process.env, PORT: '0', HOST: '0.0.0.0', NUXT_JOBS_INTERVAL_MS: '0' },
      stdio: ['ignore', 'ignore', 'pipe'],
    })
    let stderr = ''
    child.stderr!.on('data', (d) => { stderr += d })
    const code = await new Promise<number | null>((res) => {
      const timer = setTimeout(() => { child.kill(); res(null) }, 50_000)
      child.on('exit', (c) => { clearTimeout(timer); res(c) })
    })
    expect(code).toBe(1)
    expect(stderr).toMatch(/Demo mode .* refused/)
  })

  it("hides another account's reset link from the coordinator's captured mail", async () => {
    const { email } = await newHomeowner('captured')
    expect((await new Client().post('/api/auth/forgot-password', { email })).status).toBe(200)
    const [sent] = await waitForMail(email, 1, 15_000)
    const token = /token=([^\s]+)/.exec(sent!.text)![1]!
    const coordinator = await demo('coordinator')
    const r = await coordinator.get('/api/admin/mail')
    expect(r.status).toBe(200)
    const shown = (r.body.items as Array<{ to: string[]; text: string }>).filter((m) => m.to.some((t) => t.includes(email)))
    expect(shown.length).toBeGreaterThan(0)
    for (const m of shown) expect(m.text).not.toContain(token)
    expect(JSON.stringify(r.body)).not.toContain(token)
  })
})
