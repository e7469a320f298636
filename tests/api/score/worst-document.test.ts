// The largest document the schema and the body cap allow, posted while GET /api/health is polled: no request
// may hold the server for long. Before the fix an anonymous 88 MB score request held it for 26 s (its body was
// parsed and every outline checked pair by pair before the sign-in check).
import { describe, it, expect } from 'vitest'
import { BASE_URL, Client, newHomeowner } from '../../support/http'
import { MAX_DOCUMENT_VERTICES, MAX_DOCUMENT_BYTES, MAX_PLANTINGS } from '#shared/schemas/yard-document'

// a stall is counted when health takes longer than this; generous against a loaded 2-core test machine, and
// far below the 26 s a 5,000-outline document took before outlines were bounded
const STALL_MS = 2000

/** A star outline of n vertices (simple, but every edge near its neighbours: hard for crossing checks). */
function star(cx: number, cy: number, n: number, outer: number, inner: number): [number, number][] {
  return Array.from({ length: n }, (_, i) => {
    const r = i % 2 ? inner : outer
    const t = (i / n) * 2 * Math.PI
    return [cx + r * Math.cos(t), cy + r * Math.sin(t)]
  })
}

/** As many overlapping 1,000-vertex outlines as the vertex bound allows, and plantings up to the count and byte caps. */
export function worstDocument() {
  const outlines = Math.floor(MAX_DOCUMENT_VERTICES / 1000) - 1
  const label = 'L'.repeat(200)
  const plantings: Record<string, unknown>[] = []
  for (let i = 0; i < outlines; i++) plantings.push({ id: `drift${i}`, species: 'Carex pensylvanica', z: i, points: star(50 + i * 0.3, 50, 1000, 40, 39), spacing: 0.3, height: 0.2 })
  for (let i = plantings.length; i < MAX_PLANTINGS; i++) plantings.push({ id: `p${i}`, species: 'Asclepias tuberosa', label, x: 10 + (i % 80), y: 10 + Math.floor(i / 80), count: 3, spread: 0.5, height: 0.6 })
  return { format: 'wildward.yard/1', units: 'm', region: 'US-OH', boundary: star(50, 50, 1000, 49, 48.5), areas: [], plantings, lines: [] }
}

async function pollHealth(until: Promise<unknown>): Promise<number[]> {
  const took: number[] = []
  let done = false
  void until.finally(() => { done = true })
  while (!done) {
    const t0 = performance.now()
    await fetch(`${BASE_URL}/api/health`)
    took.push(performance.now() - t0)
    await new Promise((r) => setTimeout(r, 25))
  }
  return took
}

describe('the worst document', () => {
  it('fits the caps it is built to reach', () => {
    const doc = worstDocument()
    const bytes = Buffer.byteLength(JSON.stringify({ name: 'Worst', region: 'US-OH', document: doc }))
    expect(bytes).toBeLessThanOrEqual(MAX_DOCUMENT_BYTES)
    expect(doc.plantings.length).toBe(MAX_PLANTINGS)
  })

  it('is checked and saved while health keeps answering', async () => {
    const { client } = await newHomeowner('worst')
    const doc = worstDocument()
    const work = (async () => {
      const created = await client.post('/api/yards', { name: 'Worst', region: 'US-OH', document: doc })
      const saved = await client.put(`/api/yards/${created.body.id}`, { version: created.body.version, document: doc })
      return [created.status, saved.status]
    })()
    const took = await pollHealth(work)
    expect(await work).toEqual([201, 200])
    expect(took.filter((ms) => ms > STALL_MS)).toEqual([])
  }, 120_000)

  // The engine runs in a worker thread with a time limit (server/services/score-pool.ts): the worst document
  // is either scored or refused as too intricate (422 naming the document), and health answers throughout.
  it('is scored while health keeps answering', async () => {
    const { client } = await newHomeowner('worst-score')
    const work = client.post('/api/score', worstDocument())
    const took = await pollHealth(work)
    const r = await work
    expect([200, 422]).toContain(r.status)
    if (r.status === 422) {
      expect(r.body.message).toMatch(/too intricate to score/)
      expect(r.body.data.fields.document).toBeTruthy()
    } else expect(r.body.plantings).toHaveLength(MAX_PLANTINGS)
    expect(took.length).toBeGreaterThan(1)
    expect(took.filter((ms) => ms > STALL_MS)).toEqual([])
  }, 120_000)

  it('scores the largest count of point plantings while health keeps answering', async () => {
    const { client } = await newHomeowner('many-points')
    const doc = worstDocument()
    doc.plantings = doc.plantings.filter((p) => !('points' in p))
    // a 100 m square lot: every clump (x 10…89, y 10…72) stands inside it
    doc.boundary = [[0, 0], [100, 0], [100, 100], [0, 100]]
    const work = client.post('/api/score', doc)
    const took = await pollHealth(work)
    const r = await work
    expect(r.status).toBe(200)
    expect(r.body.shares.count.total).toBe(3 * doc.plantings.length)
    expect(took.filter((ms) => ms > STALL_MS)).toEqual([])
  }, 120_000)

  it('an anonymous oversized score request is refused at once, and one past the vertex bound is a 400', async () => {
    const anonymous = await new Client().request('POST', '/api/score', 'x'.repeat(MAX_DOCUMENT_BYTES + 1), { 'content-type': 'application/json' })
    expect(anonymous.status).toBe(413)
    const { client } = await newHomeowner('too-many')
    const doc = worstDocument()
    doc.plantings[0] = { ...doc.plantings[0], points: [...(doc.plantings[0]!.points as [number, number][]), ...star(0, 0, 1000, 5, 4)].slice(0, 1000) }
    doc.areas = [{ id: 'extra', kind: 'bed', points: star(20, 20, 1000, 5, 4) }] as never[]
    doc.lines = [{ id: 'wire', kind: 'overhead', points: star(20, 20, 1000, 5, 4).slice(0, 1000) }] as never[]
    const r = await client.post('/api/score', doc)
    expect(r.status).toBe(400)
    expect(r.body.message).toMatch(/outline points/)
  })
})
