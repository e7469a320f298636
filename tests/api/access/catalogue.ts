import type { AccessRow } from './types'

// The catalogue is public-domain data: reading it (table, species pages, fits, swaps) is open to everyone, so a
// homeowner can look before signing up; fits for a yard need view access to that yard. Changing it and the
// full export are for coordinators.
const ALL_200 = { anonymous: 200, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 }
const COORDINATOR = { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 403, coordinator: 200 }
const CSV = 'scientificName,region,status\nAsclepias tuberosa,US-OH,native\n'

export const rows: AccessRow[] = [
  { file: 'species/index.get.ts', method: 'GET', request: () => ({ path: '/api/species?region=US-OH&q=milkweed' }), expect: ALL_200 },
  { file: 'species/[name].get.ts', method: 'GET', request: () => ({ path: '/api/species/Asclepias%20tuberosa?region=US-OH' }), expect: ALL_200 },
  // a form with nothing changed: the coordinator's save succeeds without altering anything
  { file: 'species/[name].put.ts', method: 'PUT', request: () => ({ path: '/api/species/Asclepias%20tuberosa', body: { source: 'access check' } }), expect: COORDINATOR },
  { file: 'fits.get.ts', method: 'GET', request: () => ({ path: '/api/fits?region=US-OH&zone=6a&sun=full' }), expect: ALL_200 },
  {
    file: 'fits.get.ts', method: 'GET',
    request: (c) => ({ path: `/api/fits?yardId=${c.yardId}&sun=full` }),
    expect: { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 404 },
  },
  { file: 'swaps.get.ts', method: 'GET', request: () => ({ path: '/api/swaps?region=US-OH&zone=6a&species=Berberis%20thunbergii' }), expect: ALL_200 },
  { file: 'catalogue/export.get.ts', method: 'GET', request: () => ({ path: '/api/catalogue/export?region=US-OH&q=asclepias' }), expect: COORDINATOR },
  { file: 'catalogue/import/preview.post.ts', method: 'POST', request: () => ({ path: '/api/catalogue/import/preview', body: CSV }), expect: COORDINATOR },
  // a file with nothing to change: the apply succeeds without altering anything
  { file: 'catalogue/import/apply.post.ts', method: 'POST', request: () => ({ path: '/api/catalogue/import/apply', body: CSV }), expect: COORDINATOR },
]
