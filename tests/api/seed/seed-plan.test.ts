// Grow from seed over HTTP against the built server and MariaDB: the plan, edits with versions, the calendar
// (parsed by node-ical, an independent parser), the private feed, prices.
import { describe, it, expect, beforeAll } from 'vitest'
import ical from 'node-ical'
import { Client, demo, newHomeowner } from '../../support/http'
import { seedYard } from './fixtures'
import { daysBetween } from '#shared/utils/seed-season'
import { GRAMS_PER_POUND } from '#shared/utils/seed-size'

let owner: Awaited<ReturnType<typeof newHomeowner>>
let yardId: number
beforeAll(async () => {
  owner = await newHomeowner('seed')
  yardId = await seedYard(owner.client)
})

describe('GET /api/yards/[id]/seed-plan', () => {
  it('lists the natives with plants, pots, seed and dates for the coming season', async () => {
    const r = await owner.client.get(`/api/yards/${yardId}/seed-plan?today=2026-12-01`)
    expect(r.status).toBe(200)
    const plan = r.body
    expect(plan.margin).toBe(0.2)
    expect(plan.season).toMatchObject({ year: 2027, lastSpringFrost: '2027-04-25', firstFallFrost: '2027-10-15' })
    expect(plan.frost.rough).toBe(false)
    const names = plan.species.map((s: any) => s.scientificName)
    expect(names).toEqual(expect.arrayContaining(['Echinacea purpurea', 'Asclepias tuberosa', 'Carex pensylvanica']))
    expect(names).not.toContain('Berberis thunbergii')
    const sedge = plan.species.find((s: any) => s.scientificName === 'Carex pensylvanica')
    expect(sedge.plantsNeeded).toBe(47)
    for (const s of plan.species) {
      // pots = ceil(plants × (1 + margin) ÷ seedlings per pot) (the seed-plan rule, issue 6)
      expect(s.pots).toBe(Math.ceil(s.plantsNeeded * 1.2 / s.seedlingsPerPot - 1e-9))
      for (const k of ['sowFrom', 'sowTo', 'fridgeStart', 'plantOut', 'potUp']) if (s[k] !== null) expect(s[k]).toMatch(/^\d{4}-\d{2}-\d{2}$/)
      // plant out from six to two weeks before the first fall frost (common practice), never before pot-up
      expect(daysBetween(s.plantOut, plan.season.firstFallFrost)).toBeLessThanOrEqual(42)
      expect(daysBetween(s.plantOutBy, plan.season.firstFallFrost)).toBe(14)
      expect(s.potUp <= s.plantOut && s.germination <= s.potUp).toBe(true)
      if (s.coldMoistDays > 0 && s.sowTo) expect(daysBetween(s.sowTo, plan.season.lastSpringFrost)).toBeGreaterThanOrEqual(s.coldMoistDays)
      if (s.grams !== null) {
        // grams from USDA seeds per pound, 1 lb = 453.59237 g (NIST Handbook 44)
        expect(s.grams).toBeCloseTo(s.seeds * GRAMS_PER_POUND / s.seedsPerPound, 2)
      }
      expect(s.surfaceSow).toBe(s.treatment.some((t: string) => /on the surface/.test(t)))
    }
    expect(plan.tasks.length).toBeGreaterThan(3)
    expect(plan.totals.pots).toBe(plan.species.filter((s: any) => s.grow).reduce((n: number, s: any) => n + s.pots, 0))
  })

  it('keeps the season after the last spring frost: pot-up and plant-out stay, in the plan and the calendar', async () => {
    // SEED_DOC frosts: 04-25 and 10-15; on 2027-05-01 the 2027 season runs until 2027-10-15
    const plan = (await owner.client.get(`/api/yards/${yardId}/seed-plan?today=2027-05-01`)).body
    expect(plan.season).toMatchObject({ year: 2027, ends: '2027-10-15' })
    const kinds = new Set(plan.tasks.map((t: any) => t.kind))
    expect(kinds.has('pot-up') && kinds.has('plant-out')).toBe(true)
    const ics = await owner.client.request('GET', `/api/yards/${yardId}/seed-plan.ics?today=2027-05-01`)
    expect(ics.body as string).toMatch(/plant-out:2027-09-03/)
    // the day after the first fall frost: the next season
    expect((await owner.client.get(`/api/yards/${yardId}/seed-plan?today=2027-10-16`)).body.season.year).toBe(2028)
  })

  it('offers only natives: not "native and introduced" grasses, introduced or invasive plants', async () => {
    const doc = { format: 'wildward.yard/1', units: 'm', zone: '6a', frost: { lastSpring: '04-25', firstFall: '10-15' }, boundary: [[0, 0], [20, 0], [20, 30], [0, 30]],
      plantings: [
        // USDA PLANTS native status L48(I,N): native and introduced
        { id: 'p1', species: 'Poa pratensis', x: 1, y: 1, count: 5 },
        { id: 'p2', species: 'Phragmites australis', x: 2, y: 2, count: 5 },
        { id: 'p3', species: 'Bromus inermis', x: 3, y: 3, count: 5 },
        { id: 'p4', species: 'Berberis thunbergii', x: 4, y: 4, count: 5 },
        { id: 'p5', species: 'Asclepias tuberosa', x: 5, y: 5, count: 5 },
      ] }
    const r = await owner.client.post('/api/yards', { name: 'Natives only', region: 'US-OH', document: doc })
    expect(r.status).toBe(201)
    const plan = (await owner.client.get(`/api/yards/${r.body.id}/seed-plan?today=2026-12-01`)).body
    expect(plan.species.map((s: any) => s.scientificName)).toEqual(['Asclepias tuberosa'])
  })

  it('refuses frost dates that cannot be, naming the field', async () => {
    const base = { format: 'wildward.yard/1', units: 'm', zone: '6a', boundary: [], plantings: [] }
    const bad = await owner.client.post('/api/yards', { name: 'Bad frost', region: 'US-OH', document: { ...base, frost: { lastSpring: '02-30', firstFall: '10-15' } } })
    expect(bad.status).toBe(400)
    expect(Object.keys(bad.body.data.fields).join(' ')).toMatch(/frost\.lastSpring/)
    const order = await owner.client.post('/api/yards', { name: 'Bad frost', region: 'US-OH', document: { ...base, frost: { lastSpring: '10-20', firstFall: '04-01' } } })
    expect(order.status).toBe(400)
    expect(Object.keys(order.body.data.fields).join(' ')).toMatch(/frost\.firstFall/)
  })

  it('answers 400 for a malformed date and 404 for a yard that does not exist', async () => {
    expect((await owner.client.get(`/api/yards/${yardId}/seed-plan?today=2026-13-01`)).status).toBe(400)
    // no 30 February, and no 29 February outside leap years
    expect((await owner.client.get(`/api/yards/${yardId}/seed-plan?today=2026-02-30`)).status).toBe(400)
    expect((await owner.client.get(`/api/yards/${yardId}/seed-plan?today=2027-02-29`)).status).toBe(400)
    expect((await owner.client.get(`/api/yards/${yardId}/seed-plan?today=2028-02-29`)).status).toBe(200)
    expect((await owner.client.get('/api/yards/999999999/seed-plan')).status).toBe(404)
  })
})

describe('PUT /api/yards/[id]/seed-plan', () => {
  it('saves margin, toggles and overrides with a version, and refuses a stale one', async () => {
    const id = await seedYard(owner.client, 'Seed edits')
    const first = await owner.client.put(`/api/yards/${id}/seed-plan`, {
      version: 0, margin: 0.5,
      species: { 'Echinacea purpurea': { seedlingsPerPot: 15 }, 'Asclepias tuberosa': { grow: false } },
    })
    expect(first.status).toBe(200)
    expect(first.body.version).toBe(1)
    expect(first.body.margin).toBe(0.5)
    const cone = first.body.species.find((s: any) => s.scientificName === 'Echinacea purpurea')
    // 25 × 1.5 = 37.5 → ÷ 15 = 2.5 → 3 pots
    expect(cone).toMatchObject({ seedlingsPerPot: 15, seedlingsPerPotSource: 'plan', pots: 3 })
    const milk = first.body.species.find((s: any) => s.scientificName === 'Asclepias tuberosa')
    expect(milk.grow).toBe(false)
    expect(first.body.tasks.every((t: any) => !t.species.includes('Asclepias tuberosa'))).toBe(true)

    const stale = await owner.client.put(`/api/yards/${id}/seed-plan`, { version: 0, margin: 0.1 })
    expect(stale.status).toBe(409)
    expect(stale.body.data.currentVersion).toBe(1)

    const second = await owner.client.put(`/api/yards/${id}/seed-plan`, { version: 1, species: { 'Echinacea purpurea': { seedlingsPerPot: null } } })
    expect(second.status).toBe(200)
    expect(second.body.version).toBe(2)
    expect(second.body.species.find((s: any) => s.scientificName === 'Echinacea purpurea').seedlingsPerPotSource).not.toBe('plan')
    // the toggle saved before is kept
    expect(second.body.species.find((s: any) => s.scientificName === 'Asclepias tuberosa').grow).toBe(false)
  })

  it('names the bad field', async () => {
    const r = await owner.client.put(`/api/yards/${yardId}/seed-plan`, { version: 0, species: { 'Echinacea purpurea': { seedlingsPerPot: 0 } } })
    expect(r.status).toBe(400)
    expect(Object.keys(r.body.data.fields)).toContain('species.Echinacea purpurea.seedlingsPerPot')
  })

  it('lets a viewer read but not change the plan', async () => {
    const advisor = await demo('advisor')
    // not shared: the advisor cannot even see it
    expect((await advisor.put(`/api/yards/${yardId}/seed-plan`, { version: 0 })).status).toBe(404)
  })
})

describe('calendar', () => {
  it('the .ics download parses with the tasks on the right days', async () => {
    const plan = (await owner.client.get(`/api/yards/${yardId}/seed-plan?today=2026-12-01`)).body
    const r = await owner.client.request('GET', `/api/yards/${yardId}/seed-plan.ics?today=2026-12-01`)
    expect(r.status).toBe(200)
    expect(r.headers.get('content-type')).toMatch(/text\/calendar/)
    const parsed = ical.sync.parseICS(r.body as string)
    const events = Object.values(parsed).filter((e: any) => e.type === 'VEVENT') as any[]
    expect(events.length).toBe(plan.tasks.length)
    for (const task of plan.tasks) {
      const ev = events.find((e) => e.uid === `${task.id}.yard-${yardId}@wildward`)
      expect(ev, task.id).toBeTruthy()
      // all-day: node-ical reports the date-only start; its calendar day must be the task's day
      expect(ev.datetype).toBe('date')
      const d = ev.start as Date
      const day = `${d.getFullYear()}-${String(d.getMonth() + 1).padStart(2, '0')}-${String(d.getDate()).padStart(2, '0')}`
      expect(day).toBe(task.date)
      expect(ev.summary).toContain(task.title)
    }
  })

  it('a private subscription address works without a session and stops when revoked', async () => {
    const made = await owner.client.post('/api/calendar-feed')
    expect(made.status).toBe(201)
    const url = new URL(made.body.url)
    expect(url.pathname).toMatch(/^\/calendar\/[A-Za-z0-9_-]{43}\/seeds\.ics$/)
    const anonymous = new Client()
    const feed = await anonymous.get(url.pathname)
    expect(feed.status).toBe(200)
    const events = Object.values(ical.sync.parseICS(feed.body as string)).filter((e: any) => e.type === 'VEVENT') as any[]
    expect(events.some((e) => e.uid.endsWith(`.yard-${yardId}@wildward`))).toBe(true)
    // the status never shows the secret again
    const status = await owner.client.get('/api/calendar-feed')
    expect(status.body).toMatchObject({ active: true })
    expect(JSON.stringify(status.body)).not.toContain(url.pathname.split('/')[2]!)

    // a new address replaces the old one
    const again = await owner.client.post('/api/calendar-feed')
    expect((await anonymous.get(url.pathname)).status).toBe(404)
    expect((await anonymous.get(new URL(again.body.url).pathname)).status).toBe(200)
    expect((await owner.client.delete('/api/calendar-feed')).body.active).toBe(false)
    expect((await anonymous.get(new URL(again.body.url).pathname)).status).toBe(404)
    expect((await anonymous.get('/calendar/not-a-token/seeds.ics')).status).toBe(404)
  })
})

describe('seed prices', () => {
  it('a coordinator sets a price per gram and the plan prices the seed', async () => {
    const coordinator = await demo('coordinator')
    const set = await coordinator.put('/api/admin/seed-prices', { scientificName: 'Echinacea purpurea', pricePerGram: 3 })
    expect(set.status).toBe(200)
    const list = await coordinator.get('/api/admin/seed-prices')
    expect(list.body.items).toEqual(expect.arrayContaining([expect.objectContaining({ scientificName: 'Echinacea purpurea', pricePerGram: 3 })]))
    const plan = (await owner.client.get(`/api/yards/${yardId}/seed-plan`)).body
    const cone = plan.species.find((s: any) => s.scientificName === 'Echinacea purpurea')
    if (cone.grams !== null) expect(cone.cost).toBeCloseTo(cone.grams * 3, 2)
    const unknown = await coordinator.put('/api/admin/seed-prices', { scientificName: 'Nonexistus imaginarius', pricePerGram: 1 })
    expect(unknown.status).toBe(400)
    expect(unknown.body.data.fields.scientificName).toBeTruthy()
    expect((await owner.client.put('/api/admin/seed-prices', { scientificName: 'Echinacea purpurea', pricePerGram: 0.01 })).status).toBe(403)
  })
})
