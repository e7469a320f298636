// What goes over the wire: built assets precompressed and cached for a year as immutable (their names carry a
// hash), pages and large JSON answers compressed per request, small answers left alone, and Vary on every
// answer that comes in several codings. Raw node:http, so the bytes are seen as sent (fetch would decode them).
import { describe, it, expect } from 'vitest'
import { request } from 'node:http'
import { brotliDecompressSync, gunzipSync } from 'node:zlib'
import { BASE_URL } from '../support/http'

interface Raw { status: number; headers: Record<string, string | string[] | undefined>; body: Buffer }
function raw(path: string, headers: Record<string, string> = {}): Promise<Raw> {
  return new Promise((resolve, reject) => {
    const req = request(BASE_URL + path, { headers }, (res) => {
      const chunks: Buffer[] = []
      res.on('data', (c) => chunks.push(c))
      res.on('end', () => resolve({ status: res.statusCode ?? 0, headers: res.headers, body: Buffer.concat(chunks) }))
    })
    req.on('error', reject)
    req.end()
  })
}
const decode = (r: Raw) => (r.headers['content-encoding'] === 'br' ? brotliDecompressSync(r.body) : r.headers['content-encoding'] === 'gzip' ? gunzipSync(r.body) : r.body).toString('utf8')
const varies = (r: Raw) => String(r.headers.vary ?? '').toLowerCase().split(',').map((s) => s.trim()).filter((s) => s === 'accept-encoding').length

describe('compression and caching', () => {
  it('sends the built JavaScript precompressed, immutable for a year, with Vary: Accept-Encoding', async () => {
    const page = await raw('/login')
    const script = /\/_nuxt\/[\w.-]+\.js/.exec(page.body.toString('utf8'))?.[0]
    expect(script).toBeTruthy()
    const br = await raw(script!, { 'accept-encoding': 'gzip, deflate, br' })
    const gz = await raw(script!, { 'accept-encoding': 'gzip' })
    const plain = await raw(script!)
    expect(br.headers['content-encoding']).toBe('br')
    expect(gz.headers['content-encoding']).toBe('gzip')
    expect(plain.headers['content-encoding']).toBeUndefined()
    expect(decode(br)).toBe(plain.body.toString('utf8'))
    expect(decode(gz)).toBe(plain.body.toString('utf8'))
    expect(br.body.length).toBeLessThan(plain.body.length)
    for (const r of [br, gz, plain]) {
      expect(r.headers['cache-control']).toMatch(/max-age=31536000/)
      expect(r.headers['cache-control']).toMatch(/immutable/)
      expect(varies(r)).toBe(1)
    }
  })

  it('compresses a rendered page and a large JSON answer per request, and leaves small answers alone', async () => {
    const page = await raw('/', { 'accept-encoding': 'br' })
    expect(page.headers['content-encoding']).toBe('br')
    expect(decode(page)).toContain('<html')
    expect(varies(page)).toBe(1)

    const list = await raw('/api/species?region=US-OH&page=1', { 'accept-encoding': 'gzip' })
    expect(list.status).toBe(200)
    expect(list.headers['content-encoding']).toBe('gzip')
    expect(list.headers['content-type']).toMatch(/application\/json/)
    expect(JSON.parse(decode(list)).items.length).toBeGreaterThan(0)
    expect(varies(list)).toBe(1)

    const health = await raw('/api/health', { 'accept-encoding': 'br' })
    expect(health.headers['content-encoding']).toBeUndefined()
    expect(JSON.parse(health.body.toString('utf8'))).toEqual({ status: 'ok', database: 'ok' })
  })

  it('renders the error page readably whatever the browser accepts', async () => {
    const r = await raw('/no-such-page-here', { 'accept-encoding': 'br' })
    expect(r.status).toBe(404)
    expect(decode(r)).toContain('<html')
  })

  it('serves the web app manifest and the service worker, never cached as immutable', async () => {
    const manifest = await raw('/manifest.webmanifest')
    expect(manifest.status).toBe(200)
    const m = JSON.parse(manifest.body.toString('utf8'))
    expect(m).toMatchObject({ name: 'Wildward', display: 'standalone', start_url: '/yards' })
    expect(m.icons.map((i: { sizes: string }) => i.sizes)).toEqual(expect.arrayContaining(['192x192', '512x512']))
    const sw = await raw('/sw.js')
    expect(sw.status).toBe(200)
    expect(String(sw.headers['cache-control'] ?? '')).not.toMatch(/immutable/)
    // everything the worker loads is on this server
    expect(sw.body.toString('utf8')).not.toMatch(/https?:\/\//)
  })
})
