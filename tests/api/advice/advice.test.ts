// Advice requests, assignment and its access, visits with pins, and recommendations whose predicted shares
// are checked against the score engine's own answer after the change is applied.
import { describe, it, expect } from 'vitest'
import { demo, newHomeowner, waitForMail } from '../../support/http'
import { yardWith, openRequest, visitTo, demoAdvisorId, ADD_MILKWEED } from './fixtures'

describe('advice requests', () => {
  it('queues a request, assigns an advisor (mailed) who edits the yard until the request closes', async () => {
    const owner = await newHomeowner('advice-owner')
    const yardId = await yardWith(owner.client, { name: 'Needs advice' })
    const requestId = await openRequest(owner.client, yardId)
    // a second open request for the same yard is refused
    expect((await owner.client.post(`/api/yards/${yardId}/advice-requests`, { message: 'Again' })).status).toBe(409)

    const coordinator = await demo('coordinator')
    const advisor = await demo('advisor')
    const queue = (await coordinator.get('/api/advice-requests?status=new')).body.items
    expect(queue.find((r: { id: number }) => r.id === requestId)).toMatchObject({ yardName: 'Needs advice', status: 'new', preferredTimes: 'Saturday mornings' })
    expect((await advisor.get(`/api/yards/${yardId}`)).status).toBe(404)
    const advisors = (await coordinator.get('/api/advisors')).body.items
    expect(advisors.map((a: { email: string }) => a.email)).toContain('advisor@example.org')

    const before = (await waitForMail('advisor@example.org', 0)).length
    const assigned = await coordinator.post(`/api/advice-requests/${requestId}/assign`, { advisorId: await demoAdvisorId() })
    expect(assigned.status).toBe(200)
    expect(assigned.body).toMatchObject({ status: 'assigned', advisorName: 'Sam Fennimore' })
    const mails = await waitForMail('advisor@example.org', before + 1)
    expect(mails[0]!.subject).toBe('New advice visit: Needs advice')
    expect(mails[0]!.text).toContain(`/advice/${requestId}`)

    const seen = await advisor.get(`/api/yards/${yardId}`)
    expect(seen.body.access).toBe('edit')
    expect((await advisor.put(`/api/yards/${yardId}`, { version: seen.body.version, name: 'Needs advice (visited)' })).status).toBe(200)
    expect((await advisor.get('/api/advice-requests')).body.items.map((r: { id: number }) => r.id)).toContain(requestId)

    // not an advisor: refused with the field named
    const wrong = await coordinator.post(`/api/advice-requests/${requestId}/assign`, { advisorId: owner.user.id })
    expect(wrong.status).toBe(400)
    expect(wrong.body.data.fields.advisorId).toBeTruthy()

    expect((await owner.client.post(`/api/advice-requests/${requestId}/close`, { note: 'Thanks!' })).body.status).toBe('closed')
    expect((await advisor.get(`/api/yards/${yardId}`)).status).toBe(404)
    expect((await advisor.put(`/api/yards/${yardId}`, { version: 2, name: 'Too late' })).status).toBe(404)
    expect((await coordinator.post(`/api/advice-requests/${requestId}/assign`, { advisorId: await demoAdvisorId() })).status).toBe(409)
  })

  it('records a visit with notes and pins that the owner sees, and nobody else', async () => {
    const owner = await newHomeowner('visit-owner')
    const { visitId, yardId, advisor } = await visitTo(owner.client)
    expect((await advisor.put(`/api/visits/${visitId}`, { notes: 'Heavy clay by the downspout.' })).body.notes).toBe('Heavy clay by the downspout.')
    const pin = await advisor.post(`/api/visits/${visitId}/pins`, { x: 3.5, y: 2, comment: 'Rain garden here?' })
    expect(pin.status).toBe(201)
    const advice = (await owner.client.get(`/api/yards/${yardId}/advice`)).body
    expect(advice.pins).toEqual([expect.objectContaining({ x: 3.5, y: 2, comment: 'Rain garden here?' })])
    const visit = (await owner.client.get(`/api/visits/${visitId}`)).body
    expect(visit).toMatchObject({ notes: 'Heavy clay by the downspout.', canEdit: false, advisorName: 'Sam Fennimore' })
    expect((await owner.client.put(`/api/visits/${visitId}`, { notes: 'Owner edit' })).status).toBe(403)
    const other = await newHomeowner('visit-other')
    expect((await other.client.get(`/api/visits/${visitId}`)).status).toBe(404)
    const badPin = await advisor.post(`/api/visits/${visitId}/pins`, { x: 1, y: 1, comment: '' })
    expect(badPin.status).toBe(400)
    expect(badPin.body.data.fields.comment).toBeTruthy()
  })
})

describe('recommendations', () => {
  const sharesOf = (score: { shares: Record<string, { native: number; total: number; share: number | null }> }) => score.shares

  it('predicts shares that equal the score after each kind of change is applied', async () => {
    const owner = await newHomeowner('rec-owner')
    const { visitId, yardId, advisor } = await visitTo(owner.client)
    const changes = [
      ADD_MILKWEED,
      { kind: 'replace', plantingId: 'barberry', species: 'Echinacea purpurea', spread: 0.5, height: 0.9 },
      { kind: 'convertLawn', points: [[5, 4], [9, 4], [9, 7], [5, 7]], species: 'Asclepias tuberosa', spacing: 0.45, height: 0.6 },
    ]
    for (const change of changes) {
      const before = (await owner.client.get(`/api/yards/${yardId}/score`)).body
      const preview = await advisor.post(`/api/visits/${visitId}/recommendations/preview`, { change })
      expect(preview.status).toBe(200)
      expect(preview.body.predicted.before).toEqual(sharesOf(before))
      const rec = await advisor.post(`/api/visits/${visitId}/recommendations`, { change })
      expect(rec.status).toBe(201)
      expect(rec.body.predicted).toEqual(preview.body.predicted)
      const version = (await owner.client.get(`/api/yards/${yardId}`)).body.version
      const accepted = await owner.client.post(`/api/recommendations/${rec.body.id}/accept`, { version, apply: 'server' })
      expect(accepted.status).toBe(200)
      expect(accepted.body.yard.version).toBe(version + 1)
      expect(accepted.body.recommendation.status).toBe('accepted')
      // the score engine's answer for the saved plan (GET /api/yards/[id]/score) is the prediction
      const after = (await owner.client.get(`/api/yards/${yardId}/score`)).body
      expect(sharesOf(after)).toEqual(rec.body.predicted.after)
    }
    const shares = (await owner.client.get(`/api/yards/${yardId}/score`)).body.shares
    // the three changes turned the yard more native by area than the lawn it started with
    expect(shares.area.share).toBeGreaterThan(0.2)
    const doc = (await owner.client.get(`/api/yards/${yardId}`)).body.document
    // the barberry there now is to remove, its native successor to plant beside it
    expect(doc.plantings.find((p: { id: string }) => p.id === 'barberry')).toMatchObject({ species: 'Berberis thunbergii', phase: 'removing' })
    expect(doc.plantings.find((p: { species: string; phase?: string }) => p.species === 'Echinacea purpurea' && p.phase === 'planned')).toBeTruthy()
  })

  it('declines with a word, refuses a second decision, and keeps a stale accept proposed', async () => {
    const owner = await newHomeowner('rec-owner2')
    const { visitId, yardId, advisor } = await visitTo(owner.client)
    const a = (await advisor.post(`/api/visits/${visitId}/recommendations`, { change: ADD_MILKWEED })).body
    const b = (await advisor.post(`/api/visits/${visitId}/recommendations`, { change: { ...ADD_MILKWEED, count: 2 } })).body
    const noWord = await owner.client.post(`/api/recommendations/${a.id}/decline`, { reason: '' })
    expect(noWord.status).toBe(400)
    expect(noWord.body.data.fields.reason).toBeTruthy()
    expect((await owner.client.post(`/api/recommendations/${a.id}/decline`, { reason: 'Too tall for the window' })).body.recommendation).toMatchObject({ status: 'declined', declineReason: 'Too tall for the window' })
    expect((await owner.client.post(`/api/recommendations/${a.id}/accept`, { version: 1 })).status).toBe(409)

    const stale = await owner.client.post(`/api/recommendations/${b.id}/accept`, { version: 999 })
    expect(stale.status).toBe(409)
    const listed = (await owner.client.get(`/api/yards/${yardId}/advice`)).body.recommendations
    expect(listed.find((r: { id: number }) => r.id === b.id).status).toBe('proposed')
    // the editor's path: it applied the change itself, the server records the decision only
    const viaEditor = await owner.client.post(`/api/recommendations/${b.id}/accept`, { version: 1, apply: 'editor' })
    expect(viaEditor.body.recommendation.status).toBe('accepted')
    expect((await owner.client.get(`/api/yards/${yardId}`)).body.version).toBe(1)
    // undone in the editor: back to proposed, to decide again; only an accepted one can be taken back
    const reopened = await owner.client.post(`/api/recommendations/${b.id}/reopen`)
    expect(reopened.status).toBe(200)
    expect(reopened.body.recommendation).toMatchObject({ status: 'proposed', decidedAt: null })
    expect((await owner.client.post(`/api/recommendations/${b.id}/reopen`)).status).toBe(409)
    expect((await owner.client.post(`/api/recommendations/${a.id}/reopen`)).status).toBe(409)
    expect((await owner.client.post(`/api/recommendations/${b.id}/accept`, { version: 1, apply: 'editor' })).body.recommendation.status).toBe('accepted')
  })

  it('names the missing bed in a 400', async () => {
    const owner = await newHomeowner('rec-owner3')
    const { visitId, advisor } = await visitTo(owner.client)
    const r = await advisor.post(`/api/visits/${visitId}/recommendations/preview`, { change: { ...ADD_MILKWEED, bedId: 'no-such-bed' } })
    expect(r.status).toBe(400)
    expect(r.body.data.fields['change.bedId']).toBeTruthy()
  })
})
