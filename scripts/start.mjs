// `npm start`: everything from a fresh clone to a served app. Installs what is missing, starts a private
// MariaDB and the fake SMTP server, migrates, loads the demo data once, builds and serves on 127.0.0.1:3000.
import { join } from 'node:path'
import { existsSync } from 'node:fs'
import {
  ROOT, DATA, log, fail, ensureNodeModules, startMariaDb, ensureDatabase, migrate, startFakeSmtp, startFakePayments, build,
  spawnChild, stopAll, waitForHttp, persistentSecret, waitForChildrenExit, sessionCookieEnv,
} from './lib/services.mjs'

const port = Number(process.env.PORT || 3000)
const host = process.env.HOST || '127.0.0.1'
const appUrl = process.env.NUXT_APP_URL || `http://${host}:${port}`

let stopping = false
async function shutdown(code = 0) {
  if (stopping) return
  stopping = true
  log('stopping what npm start started')
  stopAll()
  await waitForChildrenExit()
  process.exit(code)
}
process.on('SIGINT', () => shutdown(0))
process.on('SIGTERM', () => shutdown(0))

ensureNodeModules()

let databaseUrl = process.env.DATABASE_URL
if (!databaseUrl) {
  const db = await startMariaDb()
  databaseUrl = ensureDatabase(db, process.env.WW_DB_NAME || 'wildward')
}
migrate(databaseUrl)

let smtpUrl = process.env.SMTP_URL
let captureUrl = ''
if (!smtpUrl) {
  const fake = await startFakeSmtp({
    smtpPort: Number(process.env.FAKE_SMTP_PORT || 2525),
    httpPort: Number(process.env.FAKE_SMTP_HTTP_PORT || 2580),
    store: join(DATA, 'mail.jsonl'),
  })
  smtpUrl = fake.smtpUrl
  captureUrl = fake.captureUrl
}

// the real payment service when its keys are in the environment; otherwise the local fake
let paymentsEnv = {}
if (!process.env.NUXT_PAYMENTS_SECRET_KEY) {
  const fake = await startFakePayments({
    port: Number(process.env.FAKE_PAYMENTS_PORT || 12111), webhookUrl: `${appUrl}/api/payments/webhook`, store: join(DATA, 'payments.json'),
    secretKey: 'sk_test_' + persistentSecret('fake-payments-key'), webhookSecret: 'whsec_' + persistentSecret('fake-payments-webhook'),
  })
  paymentsEnv = fake.env
}

// demo mode (published demo passwords) by default only on loopback; elsewhere only with WW_DEMO=true
const loopback = /^(127\.|localhost$|::1$|\[::1\]$)/.test(host)
const demo = process.env.WW_DEMO === 'true' || (process.env.WW_DEMO !== 'false' && loopback)
const env = {
  ...process.env,
  NUXT_TELEMETRY_DISABLED: '1',
  HOST: host,
  PORT: String(port),
  NUXT_DATABASE_URL: databaseUrl,
  NUXT_SESSION_PASSWORD: process.env.NUXT_SESSION_PASSWORD || persistentSecret('session-password') + persistentSecret('session-password-2'),
  NUXT_SMTP_URL: smtpUrl,
  NUXT_MAIL_CAPTURE_URL: captureUrl,
  NUXT_APP_URL: appUrl,
  ...sessionCookieEnv(appUrl),
  NUXT_DEMO_DATA: demo ? 'true' : 'false',
  NUXT_PUBLIC_DEMO_MODE: demo ? 'true' : 'false',
  NUXT_DEMO_EXPLICIT: process.env.WW_DEMO === 'true' ? 'true' : 'false',
  NUXT_UPLOAD_DIR: process.env.NUXT_UPLOAD_DIR || join(DATA, 'uploads'),
  ...paymentsEnv,
}

const dev = process.argv.includes('--dev')
if (dev) {
  spawnChild('nuxt dev', 'npx', ['nuxt', 'dev', '--host', host, '--port', String(port)], { env }).on('exit', (c) => shutdown(c ?? 0))
} else {
  if (process.env.WW_SKIP_BUILD !== '1' || !existsSync(join(ROOT, '.output', 'server', 'index.mjs'))) build(env)
  const server = spawnChild('server', process.execPath, [join(ROOT, '.output', 'server', 'index.mjs')], { env })
  server.on('exit', (c) => { if (!stopping) fail(`the server stopped (exit ${c})`) })
  await waitForHttp(`http://${host}:${port}/api/health`, 60_000, server)
  log(`Wildward is running at ${appUrl}`)
  if (demo) {
    log('demo sign-ins (demo only), password "wildward-demo":')
    log('  homeowner@example.org   advisor@example.org   coordinator@example.org')
    if (captureUrl) log(`captured e-mail: sign in as the coordinator and open ${appUrl}/admin/mail`)
  }
  log('press Ctrl-C to stop')
}
