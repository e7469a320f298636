// Access rows for pledge drives, pledges, the dashboard and bulk mail.
import type { AccessRow } from './types'
import { demo } from '../../support/http'
import { yardWith, visitTo, farFutureDates } from '../advice/fixtures'

const COORDINATOR = { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 403, coordinator: 200 }
const OWNER_ONLY = { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 404 }

// one far-future drive (never the running one) and one mailing to its no pledgers, made once
let future: Promise<{ driveId: number; mailingId: number }> | undefined
function futureDrive() {
  future ??= (async () => {
    const c = await demo('coordinator')
    const d = await c.post('/api/drives', { name: 'Matrix drive', ...farFutureDates(), target: 10 })
    if (d.status !== 201) throw new Error(`drive: ${d.status} ${JSON.stringify(d.body)}`)
    const m = await c.post(`/api/drives/${d.body.id}/mailings`, { kind: 'reminder', audience: 'all', subject: 'Matrix', body: 'Hello' })
    return { driveId: d.body.id, mailingId: m.body.id }
  })()
  return future
}

// a verified yard of the owner's: at the goal, pledged (without consent, so totals stay as other tests expect)
let verified: Promise<number> | undefined
function verifiedYard(c: Parameters<AccessRow['request']>[0]) {
  verified ??= (async () => {
    const yardId = await yardWith(c.owner, { allNative: true })
    await c.owner.post(`/api/yards/${yardId}/pledge`, { neighbourhood: 'Matrix Hollow', consent: false })
    const v = await visitTo(c.owner, { yardId })
    const r = await v.advisor.post(`/api/visits/${v.visitId}/verify`)
    if (r.status !== 200) throw new Error(`verify: ${r.status} ${JSON.stringify(r.body)}`)
    return yardId
  })()
  return verified
}

const current = (what: string): AccessRow => ({
  file: `drives/[id]/${what}.get.ts`, method: 'GET', request: () => ({ path: `/api/drives/current/${what}` }), expect: COORDINATOR,
})

export const rows: AccessRow[] = [
  { file: 'drives/index.get.ts', method: 'GET', request: () => ({ path: '/api/drives' }), expect: COORDINATOR },
  {
    file: 'drives/index.post.ts', method: 'POST',
    request: () => ({ path: '/api/drives', body: { name: 'Matrix drive', ...farFutureDates(), target: 5 } }),
    expect: { ...COORDINATOR, coordinator: 201 },
  },
  {
    file: 'drives/[id].put.ts', method: 'PUT',
    request: async () => {
      const { driveId } = await futureDrive()
      const d = (await (await demo('coordinator')).get('/api/drives')).body.items.find((x: { id: number }) => x.id === driveId)
      return { path: `/api/drives/${driveId}`, body: { name: d.name, startsOn: d.startsOn, endsOn: d.endsOn, target: 12, goal: 0.7, certifies: 'area' } }
    },
    expect: COORDINATOR,
  },
  current('summary'),
  current('progress'),
  current('neighbourhoods'),
  current('pledges'),
  { file: 'drives/[id]/pledges.csv.get.ts', method: 'GET', request: () => ({ path: '/api/drives/current/pledges.csv' }), expect: COORDINATOR },
  current('mailings'),
  {
    file: 'drives/[id]/mailings.post.ts', method: 'POST',
    request: async () => ({ path: `/api/drives/${(await futureDrive()).driveId}/mailings`, body: { kind: 'thanks', audience: 'verified', subject: 'Thanks', body: 'Thank you' } }),
    expect: { ...COORDINATOR, coordinator: 202 },
  },
  {
    file: 'drives/[id]/mailings/[mailingId].get.ts', method: 'GET',
    request: async () => { const f = await futureDrive(); return { path: `/api/drives/${f.driveId}/mailings/${f.mailingId}` } },
    expect: COORDINATOR,
  },
  {
    file: 'yards/[id]/pledge.post.ts', method: 'POST',
    request: async (c) => ({ path: `/api/yards/${await c.freshYard()}/pledge`, body: { neighbourhood: 'Matrix Hollow', consent: false } }),
    expect: { ...OWNER_ONLY, owner: 201 },
  },
  { file: 'yards/[id]/pledge.get.ts', method: 'GET', request: (c) => ({ path: `/api/yards/${c.yardId}/pledge` }), expect: OWNER_ONLY },
  {
    file: 'yards/[id]/pledge.delete.ts', method: 'DELETE',
    request: async (c) => {
      const yardId = await c.freshYard()
      await c.owner.post(`/api/yards/${yardId}/pledge`, { neighbourhood: 'Matrix Hollow', consent: false })
      return { path: `/api/yards/${yardId}/pledge` }
    },
    // a coordinator sees a pledged yard but never changes it
    expect: { anonymous: 401, owner: 204, otherHomeowner: 404, advisor: 404, coordinator: 403 },
  },
  {
    file: 'yards/[id]/certificate.get.ts', method: 'GET',
    request: async (c) => ({ path: `/api/yards/${await verifiedYard(c)}/certificate` }),
    // the advisor's request is still open, so they still see the yard
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 200, coordinator: 200 },
  },
]
