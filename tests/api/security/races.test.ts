// Rules that must hold when requests arrive at once: each is decided by the database, and each loser gets a
// clear answer (409, or a plain success that created nothing), never a 500.
import { describe, it, expect } from 'vitest'
import { Client, newHomeowner, demo } from '../../support/http'
import { yardWith } from '../advice/fixtures'

const statuses = (replies: Array<{ status: number }>) => replies.map((r) => r.status).sort()

describe('concurrent requests', () => {
  it('ten registrations of one e-mail: one 201, nine 409', async () => {
    const email = `race-${Date.now()}-${process.pid}@example.test`
    const replies = await Promise.all(Array.from({ length: 10 }, () => new Client().post('/api/auth/register', { email, name: 'Racer', password: 'a-long-test-password' })))
    expect(statuses(replies)).toEqual([201, ...Array(9).fill(409)])
  })

  it('ten new calendar addresses at once all succeed and leave one live address', async () => {
    const { client } = await newHomeowner('feed-race')
    const replies = await Promise.all(Array.from({ length: 10 }, () => client.post('/api/calendar-feed')))
    expect(statuses(replies)).toEqual(Array(10).fill(201))
    const live = await Promise.all(replies.map((r) => fetch(r.body.url).then((x) => x.status)))
    expect(live.filter((s) => s === 200).length).toBe(1)
  })

  it('ten advice requests for one yard at once: one open request', async () => {
    const { client } = await newHomeowner('advice-race')
    const yardId = await yardWith(client)
    const replies = await Promise.all(Array.from({ length: 10 }, () => client.post(`/api/yards/${yardId}/advice-requests`, { message: 'Help with the lawn, please', preferredTimes: '' })))
    expect(statuses(replies)).toEqual([201, ...Array(9).fill(409)])
  })

  it('concurrent pledges of one yard: exactly one answers 201 created', async () => {
    const coordinator = await demo('coordinator')
    const drives = await coordinator.get('/api/drives')
    // the demo data runs a drive (server/services/demo-data.ts)
    expect(drives.body.items.some((d: { running: boolean }) => d.running)).toBe(true)
    const { client } = await newHomeowner('pledge-race')
    const yardId = await yardWith(client, { allNative: true })
    const replies = await Promise.all(Array.from({ length: 8 }, () => client.post(`/api/yards/${yardId}/pledge`, { neighbourhood: 'Racewood', consent: true })))
    expect(statuses(replies)).toEqual([200, 200, 200, 200, 200, 200, 200, 201])
  })
})
