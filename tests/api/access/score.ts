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
]
