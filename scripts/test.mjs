// `npm test`: the same preparation as `npm start` against a fresh test database, then every suite:
// typecheck, unit tests, API tests over HTTP against the built server, browser tests in Debian's Chromium.
// Extra arguments go to vitest (`npm test -- tests/unit`). WW_INSTANCE=name keeps parallel runs apart.
import { join } from 'node:path'
import { spawnSync } from 'node:child_process'
import { rmSync, mkdirSync } from 'node:fs'
import {
  ROOT, DATA, log, ensureNodeModules, ensureChromium, ensureHaproxy, startMariaDb, ensureDatabase, migrate, startFakeSmtp, startFakePayments,
  build, spawnChild, stopAll, waitForHttp, freePort, waitForChildrenExit, fail,
} from './lib/services.mjs'

const instance = (process.env.WW_INSTANCE || '').replace(/[^a-z0-9_]/gi, '')
const suffix = instance ? `_${instance}` : ''
const vitestArgs = process.argv.slice(2)

async function finish(code) {
  stopAll()
  await waitForChildrenExit()
  process.exit(code)
}
process.on('SIGINT', () => finish(130))

ensureNodeModules()
ensureChromium()
ensureHaproxy()
// test data is thrown away: the log may be flushed about once a second instead of at every commit
const db = await startMariaDb({ durable: false })
const databaseUrl = ensureDatabase(db, `wildward_test${suffix}`, { fresh: true })
migrate(databaseUrl)

const mailStore = join(DATA, `test-mail${suffix}.jsonl`)
rmSync(mailStore, { force: true })
const fake = await startFakeSmtp({ smtpPort: await freePort(), httpPort: await freePort(), store: mailStore })

const nuxtDir = `.nuxt-test${suffix}`
const outputDir = `.output-test${suffix}`
const port = await freePort()
const baseUrl = `http://127.0.0.1:${port}`
const paymentsStore = join(DATA, `test-payments${suffix}.json`)
rmSync(paymentsStore, { force: true })
const payments = await startFakePayments({
  port: await freePort(), webhookUrl: `${baseUrl}/api/payments/webhook`, store: paymentsStore,
  secretKey: 'sk_test_wildward_tests', webhookSecret: 'whsec_wildward_tests', retryMs: 300,
})
const uploadDir = join(DATA, `test-uploads${suffix}`)
rmSync(uploadDir, { recursive: true, force: true })
const env = {
  ...process.env,
  NUXT_TELEMETRY_DISABLED: '1',
  WW_NUXT_DIR: nuxtDir,
  WW_OUTPUT_DIR: outputDir,
  HOST: '127.0.0.1',
  PORT: String(port),
  NUXT_DATABASE_URL: databaseUrl,
  NUXT_SESSION_PASSWORD: 'test-session-password-at-least-32-characters-long',
  NUXT_SMTP_URL: fake.smtpUrl,
  NUXT_MAIL_CAPTURE_URL: fake.captureUrl,
  NUXT_APP_URL: baseUrl,
  NUXT_DEMO_DATA: 'true',
  NUXT_PUBLIC_DEMO_MODE: 'true',
  NUXT_UPLOAD_DIR: uploadDir,
  // the throttle test sends X-Forwarded-For to act as several addresses
  NUXT_TRUST_PROXY: 'true',
  ...payments.env,
}

if (process.env.WW_SKIP_TYPECHECK !== '1') {
  log('type-checking (nuxt typecheck)')
  // typecheck reads the root tsconfig.json, which points at .nuxt/: generate there (under a lock for parallel runs)
  const { WW_NUXT_DIR: _, ...typecheckEnv } = env
  mkdirSync(DATA, { recursive: true })
  const r = spawnSync('flock', [join(DATA, 'typecheck.lock'), 'npx', 'nuxt', 'typecheck'], { stdio: 'inherit', cwd: ROOT, env: typecheckEnv })
  if (r.status !== 0) fail('type errors')
}
if (process.env.WW_SKIP_BUILD !== '1') build(env)

const server = spawnChild('server', process.execPath, [join(ROOT, outputDir, 'server', 'index.mjs')], { env, stdio: ['ignore', 'ignore', 'inherit'] })
await waitForHttp(`${baseUrl}/api/health`, 60_000, server)
log(`test server on ${baseUrl}`)

const r = spawnSync('npx', ['vitest', 'run', '--config', 'tests/vitest.config.ts', ...vitestArgs], {
  stdio: 'inherit',
  cwd: ROOT,
  env: { ...env, WW_BASE_URL: baseUrl, WW_MAIL_URL: fake.captureUrl, WW_PAYMENTS_URL: payments.url, WW_WEBHOOK_SECRET: 'whsec_wildward_tests', DATABASE_URL: databaseUrl, WW_SERVER_ENTRY: join(ROOT, outputDir, 'server', 'index.mjs') },
})
await finish(r.status ?? 1)
