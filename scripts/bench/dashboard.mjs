// The coordinator dashboard over 10,000 generated pledged yards (scripts/generate-pledged-yards.ts fills the
// running drive first): each figure is one aggregate query, so the summary should stay within 3× of health.
import { spawnSync } from 'node:child_process'
import mysql from 'mysql2/promise'
import { measure, report, health, signIn } from './_measure.mjs'

const WANT = 10_000
const pool = mysql.createPool({ uri: process.env.DATABASE_URL, connectionLimit: 1 })
const [[{ n }]] = await pool.query('SELECT COUNT(*) AS n FROM pledges p JOIN drives d ON d.id = p.drive_id WHERE d.starts_on <= CURDATE() AND d.ends_on >= CURDATE()')
await pool.end()
if (Number(n) < WANT) {
  const r = spawnSync('npx', ['tsx', 'scripts/generate-pledged-yards.ts', String(WANT - Number(n))], { stdio: 'inherit', env: process.env })
  if (r.status !== 0) process.exit(1)
}
const cookie = await signIn('coordinator@example.org')
const as = (path) => () => [path, { headers: { cookie } }]
const baseline = await measure('GET /api/health', health)
const rows = [
  await measure('GET /api/drives/current/summary', as('/api/drives/current/summary')),
  await measure('GET /api/drives/current/progress', as('/api/drives/current/progress')),
  await measure('GET /api/drives/current/neighbourhoods', as('/api/drives/current/neighbourhoods')),
  await measure('GET /api/drives/current/pledges?sort=share', as('/api/drives/current/pledges?sort=share&page=3')),
]
const ok = report(`Dashboard over ${WANT} pledged yards`, baseline, rows, { 'GET /api/drives/current/summary': 3 })
process.exit(ok ? 0 : 1)
