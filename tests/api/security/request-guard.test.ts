// Requests from other sites, bodies of the wrong type, and bodies larger than a route takes.
import { describe, it, expect } from 'vitest'
import { request as httpRequest } from 'node:http'
import { BASE_URL, Client, newHomeowner } from '../../support/http'

const doc = { name: 'Guarded', region: 'US-OH' }

describe('requests from elsewhere', () => {
  it('refuses JSON sent as text/plain (a form or fetch from another site needs no preflight for it)', async () => {
    const { client } = await newHomeowner('plain')
    const before = (await client.get('/api/yards')).body.items.length
    const r = await client.request('POST', '/api/yards', JSON.stringify(doc), { 'content-type': 'text/plain' })
    expect(r.status).toBe(415)
    expect((await client.get('/api/yards')).body.items.length).toBe(before)
  })

  it('refuses a foreign Origin or a cross-site Sec-Fetch-Site on creating and deleting', async () => {
    const { client } = await newHomeowner('origin')
    const yard = await client.post('/api/yards', doc)
    expect(yard.status).toBe(201)
    const evil = { origin: 'http://evil.example' }
    expect((await client.request('POST', '/api/yards', doc, evil)).status).toBe(403)
    expect((await client.request('DELETE', `/api/yards/${yard.body.id}`, undefined, evil)).status).toBe(403)
    expect((await client.request('DELETE', `/api/yards/${yard.body.id}`, undefined, { 'sec-fetch-site': 'cross-site' })).status).toBe(403)
    expect((await client.request('DELETE', `/api/yards/${yard.body.id}`, undefined, { 'sec-fetch-site': 'same-site' })).status).toBe(403)
    expect((await client.get(`/api/yards/${yard.body.id}`)).status).toBe(200)
    // the app's own pages send their own origin
    expect((await client.request('DELETE', `/api/yards/${yard.body.id}`, undefined, { origin: new URL(BASE_URL).origin, 'sec-fetch-site': 'same-origin' })).status).toBe(204)
  })

  it('takes uploads only as multipart', async () => {
    const { client } = await newHomeowner('upload-type')
    const yard = await client.post('/api/yards', doc)
    const r = await client.request('POST', `/api/yards/${yard.body.id}/backdrop`, new Uint8Array(1000), { 'content-type': 'image/png' })
    expect(r.status).toBe(415)
  })

  it('leaves the one-click unsubscribe (posted by a mail service) to its token', async () => {
    const r = await new Client().request('POST', `/seed-reminders/unsubscribe?token=${'y'.repeat(32)}`, 'List-Unsubscribe=One-Click', { 'content-type': 'application/x-www-form-urlencoded', origin: 'https://mail.example' })
    expect(r.status).toBe(404)
  })
})

/** Streams `total` bytes in chunks with no Content-Length; resolves with the status, or 'reset' if cut off. */
function streamBody(path: string, total: number, headers: Record<string, string>): Promise<number | 'reset'> {
  return new Promise((resolve) => {
    const url = new URL(path, BASE_URL)
    const req = httpRequest({ host: url.hostname, port: url.port, path: url.pathname, method: 'POST', headers: { ...headers, 'transfer-encoding': 'chunked' } }, (res) => {
      res.resume()
      resolve(res.statusCode!)
    })
    req.on('error', () => resolve('reset'))
    const chunk = Buffer.alloc(64 * 1024, 0x20)
    let sent = 0
    const pump = () => {
      while (sent < total) {
        sent += chunk.length
        if (!req.write(chunk)) return void req.once('drain', pump)
      }
      req.end()
    }
    pump()
  })
}

describe('body caps', () => {
  it('answers an anonymous 50 MB chunked score request with 401 without reading it', async () => {
    expect(await streamBody('/api/score', 50 * 1024 * 1024, { 'content-type': 'application/json' })).toBe(401)
  })

  it('cuts a signed-in chunked upload off at the cap (413), not after reading 50 MB', async () => {
    const { client } = await newHomeowner('chunked')
    const yard = await client.post('/api/yards', doc)
    const cookie = (client as unknown as { cookies: Map<string, string> }).cookies
    const header = [...cookie].map(([k, v]) => `${k}=${v}`).join('; ')
    const status = await streamBody(`/api/yards/${yard.body.id}/backdrop`, 50 * 1024 * 1024, { 'content-type': 'multipart/form-data; boundary=x', cookie: header })
    expect([413, 'reset']).toContain(status)
    expect(await streamBody('/api/auth/login', 1024 * 1024, { 'content-type': 'application/json' })).toSatisfy((s) => s === 413 || s === 'reset')
  })

  it('refuses a declared body over the cap before reading it', async () => {
    const r = await new Client().request('POST', '/api/auth/login', 'x'.repeat(200 * 1024), { 'content-type': 'application/json' })
    expect(r.status).toBe(413)
  })
})
