// GET /api/fits over the whole catalogue (no filter but region, and a typical bed), a species table page and a
// species page, beside GET /api/health. Target: fits median ≤ 3× health.
import { measure, report, health } from './_measure.mjs'

const base = await measure('GET /api/health', health)
const rows = [
  await measure('GET /api/fits (whole catalogue, US-OH)', () => ['/api/fits?region=US-OH&limit=50', {}]),
  await measure('GET /api/fits (bed: 6a, part, clay, wet)', () => ['/api/fits?region=US-OH&zone=6a&sun=part&soil=clay&moisture=wet&limit=50', {}]),
  await measure('GET /api/swaps (Berberis thunbergii)', () => ['/api/swaps?region=US-OH&zone=6a&species=Berberis%20thunbergii', {}]),
  await measure('GET /api/species (table page)', () => ['/api/species?region=US-OH&hasFacts=true&sort=name&page=3', {}]),
  await measure('GET /api/species?q= (search as you type)', () => ['/api/species?region=US-OH&q=milk&pageSize=10', {}]),
  await measure('GET /api/species/[name]', () => ['/api/species/Asclepias%20tuberosa?region=US-OH', {}]),
]
const ok = report('Species catalogue', base, rows, { 'GET /api/fits (whole catalogue, US-OH)': 3, 'GET /api/fits (bed: 6a, part, clay, wet)': 3 })
process.exit(ok ? 0 : 1)
