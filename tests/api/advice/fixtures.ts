// Yards, requests and visits for the advice and drive tests (and their access-matrix rows), made over HTTP.
import { Client, demo } from '../../support/http'

const rect = (x: number, y: number, w: number, h: number): [number, number][] => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]

/**
 * A 10 m × 10 m lot: lawn everywhere, a 4 m × 2 m bed with a native sedge drift, and (when `allNative`) a native
 * meadow over the rest of the lawn, which takes the area share to 1.
 */
export function testYardDocument({ allNative = false } = {}) {
  return {
    format: 'wildward.yard/1', units: 'm', region: 'US-OH', boundary: rect(0, 0, 10, 10),
    areas: [{ id: 'bed', kind: 'bed', z: 5, points: rect(1, 1, 4, 2), sun: 'full', soil: 'loam', moisture: 'medium', label: 'Test bed' }],
    plantings: [
      allNative
        ? { id: 'meadow', species: 'Carex pensylvanica', points: rect(0, 0, 10, 10), z: 0, spacing: 0.3, height: 0.2 }
        : { id: 'lawn', species: 'Poa pratensis', points: rect(0, 0, 10, 10), z: 0, spacing: null, height: 0.08, label: 'Lawn' },
      { id: 'sedge', species: 'Carex pensylvanica', points: rect(1, 1, 4, 2), z: 6, spacing: 0.3, height: 0.2 },
      { id: 'barberry', species: 'Berberis thunbergii', x: 8, y: 8, count: 2, spread: 1.2, height: 1.2 },
    ],
    lines: [],
  }
}

export async function yardWith(owner: Client, options: { allNative?: boolean; name?: string } = {}): Promise<number> {
  const r = await owner.post('/api/yards', { name: options.name ?? 'Advice fixture', region: 'US-OH', document: testYardDocument(options) })
  if (r.status !== 201) throw new Error(`yard: ${r.status} ${JSON.stringify(r.body)}`)
  return r.body.id
}

let advisorIdCache: number | undefined
export async function demoAdvisorId(): Promise<number> {
  advisorIdCache ??= (await (await demo('advisor')).get('/api/auth/me')).body.user.id as number
  return advisorIdCache
}

export async function openRequest(owner: Client, yardId: number): Promise<number> {
  const r = await owner.post(`/api/yards/${yardId}/advice-requests`, { message: 'What could replace the lawn?', preferredTimes: 'Saturday mornings' })
  if (r.status !== 201) throw new Error(`request: ${r.status} ${JSON.stringify(r.body)}`)
  return r.body.id
}

export async function assignedRequest(owner: Client, yardId: number): Promise<number> {
  const id = await openRequest(owner, yardId)
  const r = await (await demo('coordinator')).post(`/api/advice-requests/${id}/assign`, { advisorId: await demoAdvisorId() })
  if (r.status !== 200) throw new Error(`assign: ${r.status} ${JSON.stringify(r.body)}`)
  return id
}

/** A visit by the demo advisor to a new yard of `owner`'s, with the request still open. */
export async function visitTo(owner: Client, options: { allNative?: boolean; yardId?: number } = {}) {
  const yardId = options.yardId ?? await yardWith(owner, options)
  const requestId = await assignedRequest(owner, yardId)
  const advisor = await demo('advisor')
  const r = await advisor.post(`/api/advice-requests/${requestId}/visits`, { visitedOn: new Date().toISOString().slice(0, 10), notes: 'Walked the lot.' })
  if (r.status !== 201) throw new Error(`visit: ${r.status} ${JSON.stringify(r.body)}`)
  return { yardId, requestId, visitId: r.body.id as number, advisor }
}

export const ADD_MILKWEED = { kind: 'add', bedId: 'bed', species: 'Asclepias tuberosa', count: 5, spread: 0.45, height: 0.6 } as const

export async function recommendationOn(owner: Client) {
  const v = await visitTo(owner)
  const r = await v.advisor.post(`/api/visits/${v.visitId}/recommendations`, { change: ADD_MILKWEED })
  if (r.status !== 201) throw new Error(`recommendation: ${r.status} ${JSON.stringify(r.body)}`)
  return { ...v, recommendationId: r.body.id as number }
}

/** Unused far-future dates, so a test drive never overlaps the running demo drive or another test's. */
export function farFutureDates() {
  // one day in some year 3000–9999: two test drives collide with odds of about 1 in 2.5 million
  const day = new Date(Date.UTC(3000 + Math.floor(Math.random() * 7000), 0, 1 + Math.floor(Math.random() * 365))).toISOString().slice(0, 10)
  return { startsOn: day, endsOn: day }
}

// a 1 × 1 PNG (the signature, IHDR, IDAT and IEND chunks)
export const TINY_PNG = Uint8Array.from(Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNk+M9QDwADhgGAWjR9awAAAABJRU5ErkJggg==', 'base64'))

export function photoForm(bytes: Uint8Array = TINY_PNG, name = 'visit.png') {
  const form = new FormData()
  form.append('file', new Blob([bytes as BlobPart], { type: 'image/png' }), name)
  return form
}
