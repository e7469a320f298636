import type { AccessRow } from './types'

export const rows: AccessRow[] = [
  {
    file: 'score.post.ts', method: 'POST',
    request: () => ({ path: '/api/score', body: { region: 'US-OH', boundary: [[0, 0], [10, 0], [10, 10], [0, 10]], plantings: [{ id: 'p1', species: 'Quercus alba', x: 5, y: 5 }] } }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 },
  },
  {
    file: 'yards/[id]/score.get.ts', method: 'GET',
    request: (c) => ({ path: `/api/yards/${c.yardId}/score` }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 404 },
  },
  {
    file: 'yards/[id]/facts.get.ts', method: 'GET',
    request: (c) => ({ path: `/api/yards/${c.yardId}/facts` }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 404 },
  },
  {
    file: 'yards/[id]/history.get.ts', method: 'GET',
    request: (c) => ({ path: `/api/yards/${c.yardId}/history` }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 404 },
  },
  {
    // an id not in the plan: the owner gets as far as the check of the ids
    file: 'yards/[id]/work.post.ts', method: 'POST',
    request: (c) => ({ path: `/api/yards/${c.yardId}/work`, body: { version: 1, action: 'planted', ids: ['not-there'], date: '2026-01-02' } }),
    expect: { anonymous: 401, owner: 400, otherHomeowner: 404, advisor: 404, coordinator: 404 },
  },
  {
    file: 'species/facts.post.ts', method: 'POST',
    request: () => ({ path: '/api/species/facts', body: { region: 'US-OH', names: ['Quercus alba'] } }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 },
  },
  {
    file: 'organisation/goal.get.ts', method: 'GET',
    request: () => ({ path: '/api/organisation/goal' }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 },
  },
  {
    // the goal put back to its default, so other tests see no change
    file: 'organisation/goal.put.ts', method: 'PUT',
    request: () => ({ path: '/api/organisation/goal', body: { goal: 0.7 } }),
    expect: { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 403, coordinator: 200 },
  },
]
