// `npm run bench [name…]`: builds nothing; starts the built server (npm test's preparation is reused through
// scripts/lib), then runs each case file in scripts/bench/*.mjs and prints each route's median latency and
// throughput beside GET /api/health, measured in the same run, as ratios.
import { readdirSync } from 'node:fs'
import { join } from 'node:path'
import { spawnSync } from 'node:child_process'
import {
  ROOT, DATA, log, ensureNodeModules, startMariaDb, ensureDatabase, migrate, startFakeSmtp, build, spawnChild,
  stopAll, waitForHttp, freePort, waitForChildrenExit,
} from './lib/services.mjs'

const only = process.argv.slice(2)
ensureNodeModules()
// test data is thrown away: the log may be flushed about once a second instead of at every commit
const db = await startMariaDb({ durable: false })
const databaseUrl = ensureDatabase(db, 'wildward_bench', { fresh: process.env.WW_BENCH_KEEP !== '1' })
migrate(databaseUrl)
const fake = await startFakeSmtp({ smtpPort: await freePort(), httpPort: await freePort(), store: join(DATA, 'bench-mail.jsonl') })
const port = await freePort()
const baseUrl = `http://127.0.0.1:${port}`
const env = {
  ...process.env, NUXT_TELEMETRY_DISABLED: '1', WW_NUXT_DIR: '.nuxt-bench', WW_OUTPUT_DIR: '.output-bench', HOST: '127.0.0.1',
  PORT: String(port), NUXT_DATABASE_URL: databaseUrl, NUXT_SESSION_PASSWORD: 'bench-session-password-at-least-32-characters',
  NUXT_SMTP_URL: fake.smtpUrl, NUXT_MAIL_CAPTURE_URL: fake.captureUrl, NUXT_APP_URL: baseUrl, NUXT_DEMO_DATA: 'true',
  NUXT_PUBLIC_DEMO_MODE: 'true', NUXT_UPLOAD_DIR: join(DATA, 'bench-uploads'), NODE_ENV: 'production',
}
if (process.env.WW_SKIP_BUILD !== '1') build(env)
const server = spawnChild('server', process.execPath, [join(ROOT, '.output-bench', 'server', 'index.mjs')], { env, stdio: ['ignore', 'ignore', 'inherit'] })
await waitForHttp(`${baseUrl}/api/health`, 60_000, server)

const cases = readdirSync(join(ROOT, 'scripts', 'bench')).filter((f) => f.endsWith('.mjs') && !f.startsWith('_'))
  .filter((f) => !only.length || only.some((o) => f.includes(o)))
let code = 0
for (const file of cases) {
  log(`bench ${file}`)
  const r = spawnSync(process.execPath, [join(ROOT, 'scripts', 'bench', file)], { stdio: 'inherit', env: { ...env, WW_BASE_URL: baseUrl, DATABASE_URL: databaseUrl } })
  if (r.status !== 0) code = 1
}
stopAll()
await waitForChildrenExit()
process.exit(code)
