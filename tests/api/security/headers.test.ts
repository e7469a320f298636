// Response headers: a Content-Security-Policy allowing only the app's own origin, no framing, no sniffing,
// a referrer policy, HSTS, no X-Powered-By; personal API answers are not stored by any cache.
import { describe, it, expect } from 'vitest'
import { Client, demo } from '../../support/http'

function directives(csp: string): Map<string, string[]> {
  return new Map(csp.split(';').map((d) => d.trim()).filter(Boolean).map((d) => { const [name, ...values] = d.split(/\s+/); return [name!, values] }))
}

describe('security headers', () => {
  it('pages carry a same-origin CSP, frame-ancestors none and the usual headers', async () => {
    const r = await new Client().get('/login')
    expect(r.status).toBe(200)
    const csp = directives(r.headers.get('content-security-policy') ?? '')
    expect(csp.get('default-src')).toEqual(["'self'"])
    expect(csp.get('frame-ancestors')).toEqual(["'none'"])
    expect(csp.get('object-src')).toEqual(["'none'"])
    // every source named is the app itself (or a nonce / inline data it made), never another host
    for (const [, values] of csp) for (const v of values) expect(v).toMatch(/^('self'|'none'|'unsafe-inline'|'strict-dynamic'|'nonce-[^']+'|data:|blob:)$/)
    expect(r.headers.get('x-content-type-options')).toBe('nosniff')
    expect(r.headers.get('referrer-policy')).toBeTruthy()
    expect(r.headers.get('strict-transport-security')).toMatch(/max-age=\d+/)
    expect(r.headers.get('x-powered-by')).toBeNull()
  })

  it('personal API answers are Cache-Control: no-store', async () => {
    const c = await demo('homeowner')
    for (const path of ['/api/auth/me', '/api/yards']) {
      const r = await c.get(path)
      expect(r.status).toBe(200)
      expect(r.headers.get('cache-control')).toMatch(/no-store/)
      expect(r.headers.get('x-powered-by')).toBeNull()
    }
  })
})
