// Every route file under server/api (and the non-API ones under server/routes, as routes/…) is listed with the status each kind of user gets; a route missing from
// the table fails the test. Rows live in tests/api/access/<domain>.ts.
import { describe, it, expect, beforeAll } from 'vitest'
import { readdirSync, statSync } from 'node:fs'
import { join, relative } from 'node:path'
import { Client, demo, newHomeowner } from '../support/http'
import type { AccessContext, AccessRow, Persona } from './access/types'

const modules = import.meta.glob<{ rows: AccessRow[] }>('./access/*.ts', { eager: true })
const ROWS = Object.entries(modules).filter(([f]) => !f.endsWith('types.ts')).flatMap(([, m]) => m.rows)

const API_DIR = join(import.meta.dirname, '..', '..', 'server', 'api')
const ROUTES_DIR = join(import.meta.dirname, '..', '..', 'server', 'routes')
function filesUnder(dir: string, base: string): string[] {
  return readdirSync(dir).flatMap((name) => {
    const p = join(dir, name)
    return statSync(p).isDirectory() ? filesUnder(p, base) : [relative(base, p)]
  })
}
const routeFiles = () => [...filesUnder(API_DIR, API_DIR), ...filesUnder(ROUTES_DIR, ROUTES_DIR).map((f) => `routes/${f}`)]

const PERSONAS: Persona[] = ['anonymous', 'owner', 'otherHomeowner', 'advisor', 'coordinator']

describe('access matrix', () => {
  it('lists every route file, and only existing ones', () => {
    const files = routeFiles().sort()
    const listed = new Set(ROWS.map((r) => r.file))
    expect(files.filter((f) => !listed.has(f)), 'route files missing from the access matrix').toEqual([])
    expect([...listed].filter((f) => !files.includes(f)), 'matrix rows without a route file').toEqual([])
  })

  let ctx: AccessContext
  const clients = {} as Record<Persona, () => Promise<Client>>
  beforeAll(async () => {
    const owner = await newHomeowner('owner')
    const other = await newHomeowner('other')
    const [advisor, coordinator] = await Promise.all([demo('advisor'), demo('coordinator')])
    const freshYard = async () => (await owner.client.post('/api/yards', { name: 'Matrix fixture', region: 'US-OH' })).body.id as number
    ctx = { yardId: await freshYard(), owner: owner.client, freshYard }
    // each persona gets a fresh client per request, so a logout row cannot sign the persona out for later rows
    const logins: Record<Persona, () => Promise<Client>> = {
      anonymous: async () => new Client(),
      owner: async () => { const c = new Client(); await c.login(owner.email, 'a-long-test-password'); return c },
      otherHomeowner: async () => { const c = new Client(); await c.login(other.email, 'a-long-test-password'); return c },
      advisor: () => demo('advisor'),
      coordinator: () => demo('coordinator'),
    }
    Object.assign(clients, logins)
    void advisor; void coordinator
  })

  for (const row of ROWS) {
    it(`${row.method} ${row.file}`, async () => {
      const got: Record<string, number> = {}
      for (const persona of PERSONAS) {
        const client = await clients[persona]()
        const { path, body } = await row.request(ctx, persona)
        const r = await client.request(row.method, path, body)
        got[persona] = r.status
      }
      expect(got).toEqual(row.expect)
    })
  }
})
