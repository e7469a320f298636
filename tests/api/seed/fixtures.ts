// A yard in Ohio with three native species to plant, one native there now and one invasive, for the seed tests.
import type { Client } from '../../support/http'

export const SEED_DOC = {
  format: 'wildward.yard/2', units: 'm', zone: '6a', frost: { lastSpring: '04-25', firstFall: '10-15' },
  boundary: [[0, 0], [20, 0], [20, 30], [0, 30]],
  plantings: [
    { id: 'cone', species: 'Echinacea purpurea', x: 2, y: 2, count: 25, phase: 'planned' },
    { id: 'milk', species: 'Asclepias tuberosa', x: 4, y: 4, count: 12, phase: 'planned' },
    // 5 m × 2 m of sedge at 0.5 m: 10 ÷ (0.866 × 0.25) = 46.19 → 47 plants (triangular layout)
    { id: 'sedge', species: 'Carex pensylvanica', points: [[5, 5], [10, 5], [10, 7], [5, 7]], spacing: 0.5, phase: 'planned' },
    // a native that stands there now: nothing to raise
    { id: 'oak', species: 'Quercus alba', x: 15, y: 25, count: 1 },
    // not native in Ohio: left out of the seed plan
    { id: 'barberry', species: 'Berberis thunbergii', x: 8, y: 8, count: 3, phase: 'planned' },
  ],
}

export async function seedYard(client: Client, name = 'Seed yard') {
  const r = await client.post('/api/yards', { name, region: 'US-OH', document: SEED_DOC })
  if (r.status !== 201) throw new Error(`yard: ${r.status} ${JSON.stringify(r.body)}`)
  return r.body.id as number
}

