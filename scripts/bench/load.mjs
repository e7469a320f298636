// Load: 50 concurrent signed-in clients for 60 s of the editor's and the catalogue's mixed reads and writes
// (autocannon on loopback), then the rows are counted: every save and every new yard the server acknowledged
// must be in the database, and nothing else. Prints requests, errors, p50 and p99; targets 0 errors, p99 ≤ 150 ms.
// WW_LOAD_CLIENTS, WW_LOAD_SECONDS and WW_LOAD_RATE (requests per second per client; 0 = as fast as each
// client's answers come back) change the shape.
import autocannon from 'autocannon'
import { cpus, loadavg } from 'node:os'
import mysql from 'mysql2/promise'
import { BASE_URL } from './_measure.mjs'

const CLIENTS = Number(process.env.WW_LOAD_CLIENTS || 50)
const SECONDS = Number(process.env.WW_LOAD_SECONDS || 60)
const RATE = Number(process.env.WW_LOAD_RATE ?? 4)
const P99_TARGET_MS = 150
const json = { 'content-type': 'application/json' }

// a front yard in Ohio as the editor saves it: lot, house, a walk, a lawn drift, two beds of natives
function yardDocument(shift = 0) {
  const plants = ['Echinacea purpurea', 'Asclepias tuberosa', 'Rudbeckia hirta', 'Monarda fistulosa', 'Schizachyrium scoparium', 'Solidago rigida']
  return {
    format: 'wildward.yard/1', region: 'US-OH', units: 'ft', zone: '6a', frost: { lastSpring: '04-25', firstFall: '10-15' },
    boundary: [[0, 0], [20, 0], [20, 30], [0, 30]],
    areas: [
      { id: 'house', kind: 'building', points: [[4, 14], [16, 14], [16, 26], [4, 26]] },
      { id: 'walk', kind: 'paving', points: [[9, 0], [11, 0], [11, 14], [9, 14]] },
      { id: 'bed-1', kind: 'bed', points: [[1, 1], [8, 1], [8, 6], [1, 6]], sun: 'full', soil: 'loam', moisture: 'medium' },
      { id: 'bed-2', kind: 'bed', points: [[12, 1], [19, 1], [19, 6], [12, 6]], sun: 'part', soil: 'clay', moisture: 'medium' },
    ],
    plantings: [
      { id: 'lawn', species: 'Poa pratensis', points: [[0, 7], [20, 7], [20, 13], [0, 13]], spacing: null },
      ...Array.from({ length: 30 }, (_, i) => ({
        id: `p${i}`, species: plants[i % plants.length], x: 1.5 + (i % 6) + (i >= 15 ? 11 : 0) + (i === 0 ? shift : 0), y: 1.5 + Math.floor((i % 15) / 6) * 1.5, count: 1 + (i % 3),
      })),
    ],
  }
}

async function call(method, path, { cookie, body } = {}) {
  const r = await fetch(BASE_URL + path, { method, headers: { ...(body ? json : {}), ...(cookie ? { cookie } : {}) }, body: body ? JSON.stringify(body) : undefined })
  const text = await r.text()
  if (r.status >= 400) throw new Error(`${method} ${path}: ${r.status} ${text.slice(0, 300)}`)
  return { body: text ? JSON.parse(text) : null, cookie: r.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ') }
}

// one account and one yard per client (and a few spare), made before the clock starts
const tag = Date.now().toString(36)
const users = []
for (let i = 0; i < CLIENTS + 10; i++) {
  const email = `load-${tag}-${i}@example.test`
  const { cookie, body } = await call('POST', '/api/auth/register', { body: { email, name: `Load ${i}`, password: 'a-long-load-password' } })
  const yard = await call('POST', '/api/yards', { cookie, body: { name: `Load yard ${i}`, region: 'US-OH', document: yardDocument() } })
  users.push({ userId: body.user.id, cookie, yardId: yard.body.id, version: 0, saves: 0, creates: 0, savesSent: 0, createsSent: 0 })
}
const pool = mysql.createPool({ uri: process.env.DATABASE_URL, connectionLimit: 2 })
// what the database holds for these accounts: their yards, and each first yard's version
async function counts() {
  const [yardRows] = await pool.query('SELECT owner_id AS ownerId, COUNT(*) AS n FROM yards WHERE owner_id IN (?) GROUP BY owner_id', [users.map((u) => u.userId)])
  const [versionRows] = await pool.query('SELECT id, version FROM yards WHERE id IN (?)', [users.map((u) => u.yardId)])
  return { yards: new Map(yardRows.map((r) => [Number(r.ownerId), Number(r.n)])), versions: new Map(versionRows.map((r) => [Number(r.id), Number(r.version)])) }
}
const before = await counts()
for (const u of users) u.version = before.versions.get(u.yardId)
const terms = ['aster', 'oak', 'sedge', 'milk', 'golden', 'blue', 'fern', 'wild']

// autocannon gives each client a fresh context at the start of every pass, so a pass takes an account from the
// free list and gives it back at its end: no two clients ever edit one yard at once (a 409 would be an error)
const free = [...users]
let searches = 0
const statuses = new Map()
const note = (name, status) => {
  const key = `${name} ${status}`
  statuses.set(key, (statuses.get(key) ?? 0) + 1)
}
const user = (context) => (context.u ??= free.shift())
const withCookie = (req, context, extra = {}) => ({ ...req, ...extra, headers: { ...req.headers, ...extra.headers, cookie: user(context).cookie } })

// one pass of a client: the editor opens a yard, saves an edit, re-scores it, looks up plants, makes a new yard
const requests = [
  { method: 'GET', path: '/api/yards', setupRequest: (req, c) => withCookie(req, c), onResponse: (s) => note('GET /api/yards', s) },
  {
    method: 'GET', setupRequest: (req, c) => withCookie(req, c, { path: `/api/yards/${user(c).yardId}` }),
    onResponse: (s, body, c) => { note('GET /api/yards/[id]', s); if (s === 200) user(c).version = JSON.parse(body).version },
  },
  {
    method: 'PUT',
    setupRequest: (req, c) => {
      const u = user(c)
      u.savesSent++
      return withCookie(req, c, { path: `/api/yards/${u.yardId}`, headers: json, body: JSON.stringify({ version: u.version, document: yardDocument((u.version % 5) / 10) }) })
    },
    onResponse: (s, body, c) => {
      note('PUT /api/yards/[id]', s)
      if (s === 200) { user(c).saves++; user(c).version = JSON.parse(body).version }
    },
  },
  {
    method: 'POST', path: '/api/score',
    setupRequest: (req, c) => withCookie(req, c, { headers: json, body: JSON.stringify(yardDocument(0.3)) }),
    onResponse: (s) => note('POST /api/score', s),
  },
  {
    method: 'GET', setupRequest: (req, c) => withCookie(req, c, { path: `/api/species?q=${terms[searches++ % terms.length]}` }),
    onResponse: (s) => note('GET /api/species?q=', s),
  },
  { method: 'GET', path: '/api/fits?region=US-OH&zone=6a&sun=part&soil=clay&moisture=medium', setupRequest: (req, c) => withCookie(req, c), onResponse: (s) => note('GET /api/fits', s) },
  {
    method: 'GET', setupRequest: (req, c) => withCookie(req, c, { path: `/api/yards/${user(c).yardId}/seed-plan` }),
    onResponse: (s) => note('GET /api/yards/[id]/seed-plan', s),
  },
  {
    method: 'POST', path: '/api/yards',
    setupRequest: (req, c) => { user(c).createsSent++; return withCookie(req, c, { headers: json, body: JSON.stringify({ name: `Load extra ${tag}`, region: 'US-OH' }) }) },
    onResponse: (s, _b, c) => { note('POST /api/yards', s); if (s === 201) user(c).creates++ },
  },
  { method: 'GET', path: '/api/health', onResponse: (s, _b, c) => { note('GET /api/health', s); if (c.u) free.push(c.u) } },
]

const loadAvg = () => loadavg().map((x) => x.toFixed(2)).join(' ')
console.log(`\nLoad: ${CLIENTS} clients, ${SECONDS} s, ${RATE ? `${RATE} requests/s per client` : 'each client as fast as answers come'}; machine load before: ${loadAvg()}`)
const result = await autocannon({
  url: BASE_URL, connections: CLIENTS, duration: SECONDS, requests, ...(RATE ? { connectionRate: RATE } : {}),
  timeout: 10,
})
console.log(`machine load after: ${loadAvg()} (1, 5 and 15 minutes; ${cpus().length} cores)`)

// every acknowledged write is in the database, and nothing more
const after = await counts()
const [[flush]] = await pool.query('SELECT @@innodb_flush_log_at_trx_commit AS v')
await pool.end()
// a write still in flight when the clock stopped was never answered but may have committed: each count must lie
// between what was acknowledged and what was sent
let mismatches = 0
const within = (got, acked, sent) => got >= acked && got <= sent
for (const u of users) {
  const yardsNow = after.yards.get(u.userId) - before.yards.get(u.userId)
  const versionNow = after.versions.get(u.yardId) - before.versions.get(u.yardId)
  if (!within(yardsNow, u.creates, u.createsSent) || !within(versionNow, u.saves, u.savesSent)) {
    mismatches++
    console.log(`  user ${u.userId}: ${yardsNow} new yards (acknowledged ${u.creates}, sent ${u.createsSent}), ${versionNow} saves (acknowledged ${u.saves}, sent ${u.savesSent})`)
  }
}
const inFlight = users.reduce((n, u) => n + (u.savesSent - u.saves) + (u.createsSent - u.creates), 0)

const errors = result.errors + result.timeouts + result.non2xx
const saves = users.reduce((n, u) => n + u.saves, 0)
const creates = users.reduce((n, u) => n + u.creates, 0)
console.log(`requests ${result.requests.total} (${result.requests.average.toFixed(0)}/s), errors ${errors} (non-2xx ${result.non2xx}, connection ${result.errors}, timeouts ${result.timeouts})`)
console.log(`latency p50 ${result.latency.p50} ms, p90 ${result.latency.p90} ms, p99 ${result.latency.p99} ms, max ${result.latency.max} ms (target p99 ≤ ${P99_TARGET_MS} ms)`)
console.log(`by route and status: ${[...statuses].sort().map(([k, n]) => `${k}: ${n}`).join(', ')}`)
console.log(`rows: ${saves} saves and ${creates} new yards acknowledged, ${inFlight} writes unanswered when the clock stopped; ${mismatches ? `${mismatches} users' rows DO NOT match` : 'every user\'s yards and versions match'}`)
console.log(`InnoDB innodb_flush_log_at_trx_commit = ${flush.v}${Number(flush.v) === 1 ? ' (flushed at every commit)' : ' (relaxed for bench data: flushed about once a second)'}`)
const ok = errors === 0 && mismatches === 0 && result.latency.p99 <= P99_TARGET_MS
console.log(ok ? 'targets met' : 'targets NOT met')
process.exit(ok ? 0 : 1)
