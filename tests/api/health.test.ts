import { describe, it, expect } from 'vitest'
import { spawn } from 'node:child_process'
import { Client } from '../support/http'
import { createServer } from 'node:net'

describe('GET /api/health', () => {
  it('is 200 with the database reachable', async () => {
    const r = await new Client().get('/api/health')
    expect(r.status).toBe(200)
    expect(r.body).toEqual({ status: 'ok', database: 'ok' })
  })

  it('is 503 with a clear message when the database is not reachable', async () => {
    // a second instance of the built server pointed at a port where no database listens
    const port = await new Promise<number>((res) => { const s = createServer(); s.listen(0, '127.0.0.1', () => { const p = (s.address() as { port: number }).port; s.close(() => res(p)) }) })
    const child = spawn(process.execPath, [process.env.WW_SERVER_ENTRY!], {
      env: { ...process.env, PORT: String(port), HOST: '127.0.0.1', NUXT_DATABASE_URL: 'mysql://nobody:x@127.0.0.1:1/none', NUXT_DEMO_DATA: 'false' },
      stdio: 'ignore',
    })
    try {
      let r: Response | undefined
      for (let i = 0; i < 100 && !r; i++) {
        try { r = await fetch(`http://127.0.0.1:${port}/api/health`) } catch { await new Promise((s) => setTimeout(s, 100)) }
      }
      expect(r!.status).toBe(503)
      const body = await r!.json()
      expect(body.message).toMatch(/database is not reachable/)
    } finally {
      child.kill()
    }
  })
})
