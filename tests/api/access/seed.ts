import type { AccessRow } from './types'

const SIGNED_IN = { anonymous: 401, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 }
const COORDINATOR = { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 403, coordinator: 200 }
const OWNER_ONLY = { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 404 }

export const rows: AccessRow[] = [
  { file: 'yards/[id]/seed-plan.get.ts', method: 'GET', request: (c) => ({ path: `/api/yards/${c.yardId}/seed-plan` }), expect: OWNER_ONLY },
  {
    file: 'yards/[id]/seed-plan.put.ts', method: 'PUT',
    request: async (c) => ({ path: `/api/yards/${await c.freshYard()}/seed-plan`, body: { version: 0, margin: 0.25 } }),
    expect: OWNER_ONLY,
  },
  { file: 'yards/[id]/seed-plan.ics.get.ts', method: 'GET', request: (c) => ({ path: `/api/yards/${c.yardId}/seed-plan.ics` }), expect: OWNER_ONLY },
  { file: 'yards/[id]/seed-reminders.get.ts', method: 'GET', request: (c) => ({ path: `/api/yards/${c.yardId}/seed-reminders` }), expect: OWNER_ONLY },
  {
    file: 'yards/[id]/seed-reminders.put.ts', method: 'PUT',
    request: async (c) => ({ path: `/api/yards/${await c.freshYard()}/seed-reminders`, body: { enabled: false } }),
    expect: OWNER_ONLY,
  },
  { file: 'calendar-feed.get.ts', method: 'GET', request: () => ({ path: '/api/calendar-feed' }), expect: SIGNED_IN },
  { file: 'calendar-feed.post.ts', method: 'POST', request: () => ({ path: '/api/calendar-feed' }), expect: { ...SIGNED_IN, owner: 201, otherHomeowner: 201, advisor: 201, coordinator: 201 } },
  { file: 'calendar-feed.delete.ts', method: 'DELETE', request: () => ({ path: '/api/calendar-feed' }), expect: SIGNED_IN },
  { file: 'admin/seed-prices.get.ts', method: 'GET', request: () => ({ path: '/api/admin/seed-prices' }), expect: COORDINATOR },
  {
    file: 'admin/seed-prices.put.ts', method: 'PUT',
    request: () => ({ path: '/api/admin/seed-prices', body: { scientificName: 'Echinacea purpurea', pricePerGram: null } }),
    expect: COORDINATOR,
  },
  { file: 'admin/seed-reminders.get.ts', method: 'GET', request: () => ({ path: '/api/admin/seed-reminders' }), expect: COORDINATOR },
  // non-API routes: the calendar feed's secret address is its own credential (anyone holding it reads it);
  // the unsubscribe page changes nothing on GET, and a link that names no subscription is a 404 for everyone
  {
    file: 'routes/calendar/[token]/seeds.ics.get.ts', method: 'GET',
    request: async (c) => ({ path: new URL((await c.owner.post('/api/calendar-feed')).body.url).pathname }),
    expect: { anonymous: 200, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 },
  },
  { file: 'routes/seed-reminders/unsubscribe.get.ts', method: 'GET', request: () => ({ path: '/seed-reminders/unsubscribe?token=' + 'x'.repeat(32) }), expect: { anonymous: 200, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 } },
  { file: 'routes/seed-reminders/unsubscribe.post.ts', method: 'POST', request: () => ({ path: '/seed-reminders/unsubscribe?token=' + 'x'.repeat(32) }), expect: { anonymous: 404, owner: 404, otherHomeowner: 404, advisor: 404, coordinator: 404 } },
]
