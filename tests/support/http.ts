// A small HTTP client for API tests: real requests to the built server, with a cookie jar per client.
export const BASE_URL = process.env.WW_BASE_URL ?? 'http://127.0.0.1:3000'
export const MAIL_URL = process.env.WW_MAIL_URL ?? 'http://127.0.0.1:2580'
export const DEMO_PASSWORD = 'wildward-demo'

export interface Reply<T = any> { status: number; body: T; headers: Headers }

export class Client {
  private cookies = new Map<string, string>()

  /** `base` is another server (the scale-out test's proxy); the built test server by default. */
  constructor(private base: string = BASE_URL) {}

  async request<T = any>(method: string, path: string, body?: unknown, headers: Record<string, string> = {}): Promise<Reply<T>> {
    const init: RequestInit = { method, headers: { ...headers }, redirect: 'manual' }
    if (this.cookies.size) (init.headers as Record<string, string>).cookie = [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ')
    if (body !== undefined) {
      if (typeof body === 'string' || body instanceof Uint8Array || body instanceof FormData) init.body = body as BodyInit
      else {
        init.body = JSON.stringify(body)
        ;(init.headers as Record<string, string>)['content-type'] = 'application/json'
      }
    }
    const res = await fetch(this.base + path, init)
    for (const c of res.headers.getSetCookie()) {
      const [pair] = c.split(';')
      const i = pair!.indexOf('=')
      const name = pair!.slice(0, i)
      const value = pair!.slice(i + 1)
      if (value === '' || /max-age=0/i.test(c)) this.cookies.delete(name)
      else this.cookies.set(name, value)
    }
    const text = await res.text()
    let parsed: unknown = text
    try { parsed = text ? JSON.parse(text) : null } catch {}
    return { status: res.status, body: parsed as T, headers: res.headers }
  }

  /** The Cookie header this client sends, for a raw fetch. */
  cookieHeader() { return [...this.cookies].map(([k, v]) => `${k}=${v}`).join('; ') }

  get<T = any>(path: string) { return this.request<T>('GET', path) }
  post<T = any>(path: string, body?: unknown) { return this.request<T>('POST', path, body ?? {}) }
  put<T = any>(path: string, body?: unknown) { return this.request<T>('PUT', path, body ?? {}) }
  patch<T = any>(path: string, body?: unknown) { return this.request<T>('PATCH', path, body ?? {}) }
  delete<T = any>(path: string) { return this.request<T>('DELETE', path) }

  async login(email: string, password = DEMO_PASSWORD) {
    const r = await this.post('/api/auth/login', { email, password })
    if (r.status !== 200) throw new Error(`login ${email} failed: ${r.status} ${JSON.stringify(r.body)}`)
    return r.body.user as { id: number; email: string; role: string }
  }
}

let counter = 0
/** A fresh homeowner account with a unique e-mail. */
export async function newHomeowner(prefix = 'user', base = BASE_URL) {
  const c = new Client(base)
  const email = `${prefix}-${Date.now()}-${process.pid}-${++counter}@example.test`
  const r = await c.post('/api/auth/register', { email, name: `Test ${prefix}`, password: 'a-long-test-password' })
  if (r.status !== 201) throw new Error(`register failed: ${r.status} ${JSON.stringify(r.body)}`)
  return { client: c, email, user: r.body.user as { id: number; email: string; role: string } }
}

export async function demo(role: 'homeowner' | 'advisor' | 'coordinator', base = BASE_URL) {
  const c = new Client(base)
  await c.login(`${role}@example.org`)
  return c
}

/** Messages captured by the fake SMTP server for an address, newest first. */
export async function mailTo(address: string): Promise<Array<{ subject: string; text: string; to: string[]; headers: Record<string, string> }>> {
  const r = await fetch(`${MAIL_URL}/messages?to=${encodeURIComponent(address)}`)
  return r.json()
}

/** Polls the captured mail to an address until `count` messages pass `keep` (the capture can lag the SMTP reply). */
export async function mailUntil(address: string, count: number, keep: (m: { subject: string }) => boolean = () => true, timeoutMs = 15_000) {
  const until = Date.now() + timeoutMs
  for (;;) {
    const list = (await mailTo(address)).filter(keep)
    if (list.length >= count || Date.now() > until) return list
    await new Promise((r) => setTimeout(r, 200))
  }
}

/** Waits for the next mail to an address (mail is sent in the request, but give SMTP a moment). */
export async function waitForMail(address: string, count = 1, timeoutMs = 5000) {
  const until = Date.now() + timeoutMs
  for (;;) {
    const list = await mailTo(address)
    if (list.length >= count || Date.now() > until) return list
    await new Promise((r) => setTimeout(r, 100))
  }
}
