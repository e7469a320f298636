// Several app instances behind one proxy, for the scale-out test and the load benchmark: HAProxy from Debian's
// packages (round robin, health-checked), s3rver from the registry as the S3-compatible upload store, and the
// built server started on a port of its own. Each start returns { url, child, stop }; nothing outlives stop().
import { spawn } from 'node:child_process'
import { mkdirSync, writeFileSync } from 'node:fs'
import { createRequire } from 'node:module'
import { join } from 'node:path'
import { freePort } from './services.mjs'

const require = createRequire(import.meta.url)

/** Polls `url` until it answers below 500; throws when `child` exits first or the time is up. */
async function waitUntilUp(url, child, timeoutMs, name) {
  let exited = child.exitCode !== null
  child.once('exit', () => { exited = true })
  const until = Date.now() + timeoutMs
  while (Date.now() < until) {
    if (exited) throw new Error(`${name} stopped at start`)
    try {
      if ((await fetch(url)).status < 500) return
    } catch {}
    await new Promise((r) => setTimeout(r, 150))
  }
  throw new Error(`${name} did not answer ${url} within ${timeoutMs / 1000} s`)
}

function stopper(child) {
  return () => new Promise((res) => {
    if (child.exitCode !== null || child.signalCode !== null) return res()
    const t = setTimeout(() => child.kill('SIGKILL'), 10_000)
    child.once('exit', () => { clearTimeout(t); res() })
    child.kill('SIGTERM')
  })
}

/** The S3 fake on loopback with one bucket; its objects are files under `dir`. Keys are s3rver's defaults. */
export async function startS3Fake({ dir, bucket }) {
  mkdirSync(dir, { recursive: true })
  const port = await freePort()
  const bin = join(require.resolve('s3rver/package.json'), '..', 'bin', 's3rver.js')
  const child = spawn(process.execPath, [bin, '--directory', dir, '--address', '127.0.0.1', '--port', String(port), '--silent',
    '--no-vhost-buckets', '--configure-bucket', bucket], { stdio: ['ignore', 'ignore', 'inherit'] })
  const url = `http://127.0.0.1:${port}`
  await waitUntilUp(`${url}/${bucket}`, child, 20_000, 's3rver')
  return {
    url, child, stop: stopper(child),
    // what an app instance needs to use it (NUXT_UPLOAD_DRIVER=s3)
    env: {
      NUXT_UPLOAD_DRIVER: 's3', NUXT_UPLOAD_S3_ENDPOINT: url, NUXT_UPLOAD_S3_BUCKET: bucket, NUXT_UPLOAD_S3_REGION: 'us-east-1',
      NUXT_UPLOAD_S3_ACCESS_KEY_ID: 'S3RVER', NUXT_UPLOAD_S3_SECRET_ACCESS_KEY: 'S3RVER',
    },
  }
}

/** One built app server (`entry`: a build's server/index.mjs) on a free loopback port, ready when health is. */
export async function startAppInstance({ entry, env, name = 'app' }) {
  const port = await freePort()
  const child = spawn(process.execPath, [entry], {
    env: { ...process.env, ...env, HOST: '127.0.0.1', PORT: String(port) },
    stdio: ['ignore', 'ignore', 'inherit'],
  })
  const url = `http://127.0.0.1:${port}`
  await waitUntilUp(`${url}/api/health`, child, 90_000, name)
  return { url, port, child, stop: stopper(child) }
}

/**
 * HAProxy in the foreground, round robin over `backends` ([{ name, port }]) with health checks on /api/health.
 * `port` defaults to a free one. It retries a request that could not connect on the other instance, replaces X-Forwarded-For with the address it saw (a client cannot forge its own), and names the instance
 * that answered in `X-Served-By`.
 */
export async function startProxy({ dir, backends, port }) {
  mkdirSync(dir, { recursive: true })
  port ??= await freePort()
  const config = [
    'global',
    '  maxconn 2000',
    'defaults',
    '  mode http',
    '  timeout connect 5s',
    '  timeout client 60s',
    '  timeout server 60s',
    '  option http-keep-alive',
    // a request that could not reach an instance (stopped, restarting) goes to the other one
    '  retries 2',
    '  option redispatch 1',
    '  retry-on conn-failure',
    'frontend web',
    `  bind 127.0.0.1:${port}`,
    '  http-request set-header X-Forwarded-For %[src]',
    '  http-request set-header X-Forwarded-Proto http',
    '  default_backend app',
    'backend app',
    '  balance roundrobin',
    '  option httpchk GET /api/health',
    '  http-response set-header X-Served-By %s',
    ...backends.map((b) => `  server ${b.name} 127.0.0.1:${b.port} check inter 1s fall 2 rise 1`),
    '',
  ].join('\n')
  const file = join(dir, 'haproxy.cfg')
  writeFileSync(file, config)
  // -db: stay in the foreground, so stopping the child stops the proxy
  const child = spawn('haproxy', ['-db', '-f', file], { stdio: ['ignore', 'ignore', 'inherit'] })
  const url = `http://127.0.0.1:${port}`
  await waitUntilUp(`${url}/api/health`, child, 20_000, 'haproxy')
  return { url, port, child, stop: stopper(child) }
}
