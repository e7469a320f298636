// Access rows for sharing, advice requests, visits and recommendations.
import type { AccessRow, AccessContext, Persona } from './types'
import { waitForMail } from '../../support/http'

import { yardWith, openRequest, assignedRequest, visitTo, recommendationOn, demoAdvisorId, ADD_MILKWEED, photoForm } from '../advice/fixtures'

const OWNER_ONLY = { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 404 }
const COORDINATOR = { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 403, coordinator: 200 }
// on a yard with a visit: the owner may look but not change it, the visiting advisor may change it
const VISIT_EDIT = (ok: number) => ({ anonymous: 401, owner: 403, otherHomeowner: 404, advisor: ok, coordinator: 403 })

let n = 0
const unique = () => `invitee-${Date.now()}-${++n}@example.test`

async function invite(c: AccessContext) {
  const r = await c.owner.post(`/api/yards/${c.yardId}/invites`, { email: unique(), role: 'viewer' })
  const mail = await waitForMail(r.body.email)
  const token = /(?:\/invites\/|invite=)([A-Za-z0-9_-]{20,})/.exec(mail[0]?.text ?? '')?.[1]
  return { id: r.body.id as number, token: token! }
}

const visits = new Map<Persona, Promise<Awaited<ReturnType<typeof visitTo>>>>()
// one visit per persona (a row may change it), made the first time that persona needs it
function visitFor(c: AccessContext, p: Persona, key: string) {
  const k = `${key}:${p}` as Persona
  if (!visits.has(k)) visits.set(k, visitTo(c.owner))
  return visits.get(k)!
}

export const rows: AccessRow[] = [
  { file: 'yards/[id]/invites.get.ts', method: 'GET', request: (c) => ({ path: `/api/yards/${c.yardId}/invites` }), expect: OWNER_ONLY },
  {
    file: 'yards/[id]/invites.post.ts', method: 'POST',
    request: (c) => ({ path: `/api/yards/${c.yardId}/invites`, body: { email: unique(), role: 'viewer' } }),
    expect: { ...OWNER_ONLY, owner: 201 },
  },
  {
    file: 'yards/[id]/invites/[inviteId].delete.ts', method: 'DELETE',
    request: async (c) => ({ path: `/api/yards/${c.yardId}/invites/${(await invite(c)).id}` }),
    expect: { ...OWNER_ONLY, owner: 204 },
  },
  {
    file: 'yards/[id]/members/[userId].delete.ts', method: 'DELETE',
    // the demo advisor is not a member of this yard: the owner hears so, others may not know the yard exists
    request: async (c) => ({ path: `/api/yards/${c.yardId}/members/${await demoAdvisorId()}` }),
    expect: { ...OWNER_ONLY, owner: 404 },
  },
  {
    file: 'invites/[token].get.ts', method: 'GET',
    request: async (c) => ({ path: `/api/invites/${(await invite(c)).token}` }),
    expect: { anonymous: 200, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 },
  },
  {
    file: 'invites/[token]/accept.post.ts', method: 'POST',
    // the invite is for another address than any persona's
    request: async (c) => ({ path: `/api/invites/${(await invite(c)).token}/accept` }),
    expect: { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 403, coordinator: 403 },
  },
  {
    file: 'yards/[id]/advice-requests.post.ts', method: 'POST',
    request: async (c) => ({ path: `/api/yards/${await c.freshYard()}/advice-requests`, body: { message: 'Help with the lawn', preferredTimes: '' } }),
    expect: { ...OWNER_ONLY, owner: 201 },
  },
  { file: 'yards/[id]/advice.get.ts', method: 'GET', request: (c) => ({ path: `/api/yards/${c.yardId}/advice` }), expect: OWNER_ONLY },
  {
    file: 'advice-requests/index.get.ts', method: 'GET', request: () => ({ path: '/api/advice-requests' }),
    expect: { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 200, coordinator: 200 },
  },
  {
    file: 'advice-requests/[id].get.ts', method: 'GET',
    request: async (c) => ({ path: `/api/advice-requests/${await openRequest(c.owner, await c.freshYard())}` }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 200 },
  },
  {
    file: 'advice-requests/[id]/assign.post.ts', method: 'POST',
    request: async (c) => ({ path: `/api/advice-requests/${await openRequest(c.owner, await c.freshYard())}/assign`, body: { advisorId: await demoAdvisorId() } }),
    expect: COORDINATOR,
  },
  {
    file: 'advice-requests/[id]/close.post.ts', method: 'POST',
    request: async (c) => ({ path: `/api/advice-requests/${await openRequest(c.owner, await c.freshYard())}/close`, body: {} }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 200 },
  },
  {
    file: 'advice-requests/[id]/visits.post.ts', method: 'POST',
    request: async (c) => ({ path: `/api/advice-requests/${await assignedRequest(c.owner, await c.freshYard())}/visits`, body: { visitedOn: '2026-05-02', notes: '' } }),
    expect: { anonymous: 401, owner: 403, otherHomeowner: 404, advisor: 201, coordinator: 403 },
  },
  { file: 'advisors/index.get.ts', method: 'GET', request: () => ({ path: '/api/advisors' }), expect: COORDINATOR },
  {
    file: 'visits/[id].get.ts', method: 'GET',
    request: async (c, p) => ({ path: `/api/visits/${(await visitFor(c, p, 'get')).visitId}` }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 200, coordinator: 200 },
  },
  {
    file: 'visits/[id].put.ts', method: 'PUT',
    request: async (c, p) => ({ path: `/api/visits/${(await visitFor(c, p, 'put')).visitId}`, body: { notes: 'Clay soil, full sun.' } }),
    expect: VISIT_EDIT(200),
  },
  {
    file: 'visits/[id]/pins.post.ts', method: 'POST',
    request: async (c, p) => ({ path: `/api/visits/${(await visitFor(c, p, 'pin')).visitId}/pins`, body: { x: 2, y: 2, comment: 'Soggy here' } }),
    expect: VISIT_EDIT(201),
  },
  {
    file: 'visits/[id]/pins/[childId].delete.ts', method: 'DELETE',
    request: async (c, p) => {
      const v = await visitFor(c, p, 'unpin')
      const pin = await v.advisor.post(`/api/visits/${v.visitId}/pins`, { x: 1, y: 1, comment: 'Gone soon' })
      return { path: `/api/visits/${v.visitId}/pins/${pin.body.id}` }
    },
    expect: VISIT_EDIT(204),
  },
  {
    file: 'visits/[id]/photos.post.ts', method: 'POST',
    request: async (c, p) => ({ path: `/api/visits/${(await visitFor(c, p, 'photo')).visitId}/photos`, body: photoForm() }),
    expect: VISIT_EDIT(201),
  },
  {
    file: 'visits/[id]/photos/[childId].get.ts', method: 'GET',
    request: async (c, p) => {
      const v = await visitFor(c, p, 'get')
      const photo = await v.advisor.request('POST', `/api/visits/${v.visitId}/photos`, photoForm())
      return { path: `/api/visits/${v.visitId}/photos/${photo.body.id}` }
    },
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 200, coordinator: 200 },
  },
  {
    file: 'visits/[id]/photos/[childId].delete.ts', method: 'DELETE',
    request: async (c, p) => {
      const v = await visitFor(c, p, 'unphoto')
      const photo = await v.advisor.request('POST', `/api/visits/${v.visitId}/photos`, photoForm())
      return { path: `/api/visits/${v.visitId}/photos/${photo.body.id}` }
    },
    expect: VISIT_EDIT(204),
  },
  {
    file: 'visits/[id]/recommendations.post.ts', method: 'POST',
    request: async (c, p) => ({ path: `/api/visits/${(await visitFor(c, p, 'rec')).visitId}/recommendations`, body: { change: ADD_MILKWEED } }),
    expect: VISIT_EDIT(201),
  },
  {
    file: 'visits/[id]/recommendations/preview.post.ts', method: 'POST',
    request: async (c, p) => ({ path: `/api/visits/${(await visitFor(c, p, 'preview')).visitId}/recommendations/preview`, body: { change: ADD_MILKWEED } }),
    expect: VISIT_EDIT(200),
  },
  {
    file: 'visits/[id]/verify.post.ts', method: 'POST',
    request: async (c) => {
      const yardId = await yardWith(c.owner, { allNative: true })
      await c.owner.post(`/api/yards/${yardId}/pledge`, { neighbourhood: 'Matrix Hollow', consent: false })
      return { path: `/api/visits/${(await visitTo(c.owner, { yardId })).visitId}/verify` }
    },
    // the coordinator may view a pledged yard's visit but only its advisor verifies
    expect: VISIT_EDIT(200),
  },
  {
    file: 'recommendations/[id]/accept.post.ts', method: 'POST',
    request: async (c) => {
      const r = await recommendationOn(c.owner)
      const version = (await c.owner.get(`/api/yards/${r.yardId}`)).body.version
      return { path: `/api/recommendations/${r.recommendationId}/accept`, body: { version, apply: 'server' } }
    },
    // the advisor edits the yard but only the owner decides
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 403, coordinator: 404 },
  },
  {
    file: 'recommendations/[id]/reopen.post.ts', method: 'POST',
    request: async (c) => {
      const r = await recommendationOn(c.owner)
      await c.owner.post(`/api/recommendations/${r.recommendationId}/accept`, { version: 1, apply: 'editor' })
      return { path: `/api/recommendations/${r.recommendationId}/reopen` }
    },
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 403, coordinator: 404 },
  },
  {
    file: 'recommendations/[id]/decline.post.ts', method: 'POST',
    request: async (c) => ({ path: `/api/recommendations/${(await recommendationOn(c.owner)).recommendationId}/decline`, body: { reason: 'We like the lawn' } }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 403, coordinator: 404 },
  },
]

