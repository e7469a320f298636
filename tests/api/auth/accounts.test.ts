import { describe, it, expect } from 'vitest'
import { Client, newHomeowner, waitForMail, demo } from '../../support/http'

describe('accounts', () => {
  it('registers, signs out and signs in again', async () => {
    const { client, email, user } = await newHomeowner('reg')
    expect(user.role).toBe('homeowner')
    expect((await client.get('/api/auth/me')).body.user.email).toBe(email)
    await client.post('/api/auth/logout')
    expect((await client.get('/api/auth/me')).status).toBe(401)
    const again = new Client()
    await again.login(email, 'a-long-test-password')
    expect((await again.get('/api/auth/me')).status).toBe(200)
  })

  it('names the bad fields on registration and refuses a taken e-mail', async () => {
    const c = new Client()
    const bad = await c.post('/api/auth/register', { email: 'not-an-email', name: '', password: 'short' })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.data.fields).sort()).toEqual(['email', 'name', 'password'])
    const taken = await c.post('/api/auth/register', { email: 'homeowner@example.org', name: 'X', password: 'a-long-test-password' })
    expect(taken.status).toBe(409)
    expect(taken.body.data.fields.email).toMatch(/already exists/)
  })

  it('resets a password with a single-use e-mailed link', async () => {
    const { email } = await newHomeowner('reset')
    const c = new Client()
    expect((await c.post('/api/auth/forgot-password', { email })).status).toBe(200)
    // sent by the job queue (every few seconds), not in the request
    const [mail] = await waitForMail(email, 1, 15_000)
    expect(mail?.subject).toMatch(/Reset/)
    const token = decodeURIComponent(/token=([^\s]+)/.exec(mail!.text)![1]!)
    const first = await c.post('/api/auth/reset-password', { token, password: 'a-brand-new-password' })
    expect(first.status).toBe(200)
    const second = await c.post('/api/auth/reset-password', { token, password: 'yet-another-password' })
    expect(second.status).toBe(400)
    await new Client().login(email, 'a-brand-new-password')
  })

  it('changes the password only with the current one', async () => {
    const { client, email } = await newHomeowner('change')
    const wrong = await client.put('/api/auth/password', { currentPassword: 'nope-nope-nope', newPassword: 'a-second-long-password' })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.fields.currentPassword).toBeTruthy()
    expect((await client.put('/api/auth/password', { currentPassword: 'a-long-test-password', newPassword: 'a-second-long-password' })).status).toBe(200)
    await new Client().login(email, 'a-second-long-password')
  })

  it('slows an e-mail from the addresses that failed, never the right password from one that did not', async () => {
    // OWASP ASVS 4.0 2.2.1: anti-automation that an attacker cannot turn into a lock-out of the owner
    const { email } = await newHomeowner('throttle')
    const c = new Client()
    const attacker = { 'x-forwarded-for': '198.51.100.7' }
    const statuses: number[] = []
    for (let i = 0; i < 6; i++) statuses.push((await c.request('POST', '/api/auth/login', { email, password: 'wrong-password' }, attacker)).status)
    expect(statuses).toEqual([401, 401, 401, 401, 401, 429])
    // from the failing address even the right password waits (no password check is made at all)
    const slowed = await c.request('POST', '/api/auth/login', { email, password: 'a-long-test-password' }, attacker)
    expect(slowed.status).toBe(429)
    expect(Number(slowed.headers.get('retry-after'))).toBeGreaterThan(0)
    // the owner, from an address that has not failed, signs in
    const owner = await new Client().request('POST', '/api/auth/login', { email, password: 'a-long-test-password' }, { 'x-forwarded-for': '198.51.100.99' })
    expect(owner.status).toBe(200)
  })

  it('counts parallel attempts atomically: 40 at once get exactly 5 password checks', async () => {
    const { email } = await newHomeowner('race-throttle')
    const address = { 'x-forwarded-for': `192.0.2.${(process.pid % 200) + 1}` }
    const replies = await Promise.all(Array.from({ length: 40 }, () => new Client().request('POST', '/api/auth/login', { email, password: 'wrong-password' }, address)))
    const count = (s: number) => replies.filter((r) => r.status === s).length
    expect({ checked: count(401), refused: count(429) }).toEqual({ checked: 5, refused: 35 })
  })

  it('throttles failed sign-ins per address across e-mails', async () => {
    const c = new Client()
    const address = { 'x-forwarded-for': `203.0.113.${(process.pid % 200) + 1}` }
    let last = 0
    for (let i = 0; i < 31; i++) last = (await c.request('POST', '/api/auth/login', { email: `nobody-${i}-${Date.now()}@example.test`, password: 'wrong-password' }, address)).status
    expect(last).toBe(429)
  })

  it('lets a coordinator change roles, and nobody else', async () => {
    const { client, user } = await newHomeowner('promote')
    expect((await client.put(`/api/users/${user.id}/role`, { role: 'coordinator' })).status).toBe(403)
    const coordinator = await demo('coordinator')
    const r = await coordinator.put(`/api/users/${user.id}/role`, { role: 'advisor' })
    expect(r.status).toBe(200)
    expect(r.body.role).toBe('advisor')
    // the change takes effect at once for the signed-in user
    expect((await client.get('/api/auth/me')).body.user.role).toBe('advisor')
    const list = await coordinator.get(`/api/users?q=${encodeURIComponent(user.email)}`)
    expect(list.body.items.map((u: { id: number }) => u.id)).toEqual([user.id])
  })
})
