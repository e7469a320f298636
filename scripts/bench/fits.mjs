// GET /api/fits over the whole catalogue (no filter but region, and a typical bed), a species table page, search
// as you type and a species page, beside GET /api/health. No route keeps answers between requests, so every
// request does the whole work. Targets: fits and search as you type median ≤ 2× health.
import { measure, report, health } from './_measure.mjs'

const base = await measure('GET /api/health', health)
let n = 0
const pair = () => { const k = n++ % 676; return String.fromCharCode(97 + Math.floor(k / 26), 97 + (k % 26)) }
const rows = [
  await measure('GET /api/fits (whole catalogue, US-OH)', () => ['/api/fits?region=US-OH&limit=50', {}]),
  await measure('GET /api/fits (bed: 6a, part, clay, wet)', () => ['/api/fits?region=US-OH&zone=6a&sun=part&soil=clay&moisture=wet&limit=50', {}]),
  await measure('GET /api/swaps (Berberis thunbergii)', () => ['/api/swaps?region=US-OH&zone=6a&species=Berberis%20thunbergii', {}]),
  await measure('GET /api/species (table page)', () => ['/api/species?region=US-OH&hasFacts=true&sort=name&page=3', {}]),
  await measure('GET /api/species?q= (search as you type)', () => ['/api/species?region=US-OH&q=milk&pageSize=10', {}]),
  await measure('GET /api/species?q= (accented, hybrid)', () => [`/api/species?region=US-OH&q=${n++ % 2 ? 'gasp%C3%A9' : 'acer%20%C3%97fr'}&pageSize=10`, {}]),
  await measure('GET /api/species/[name]', () => ['/api/species/Asclepias%20tuberosa?region=US-OH', {}]),
  // a new term or bed on each request, so no cached answer helps
  await measure('GET /api/species?q= (a new term each time)', () => [`/api/species?region=US-OH&q=${pair()}&pageSize=10`, {}]),
  await measure('GET /api/species?q=&sort=name (new term)', () => [`/api/species?region=US-OH&q=${pair()}&sort=name&page=2`, {}]),
  await measure('GET /api/fits (a new maxSpread each time)', () => [`/api/fits?region=US-OH&zone=6a&sun=full&maxSpread=${(0.1 + 0.01 * n++).toFixed(2)}&limit=50`, {}]),
]
const ok = report('Species catalogue', base, rows, {
  'GET /api/fits (whole catalogue, US-OH)': 2, 'GET /api/fits (bed: 6a, part, clay, wet)': 2, 'GET /api/fits (a new maxSpread each time)': 2,
  'GET /api/species?q= (search as you type)': 2, 'GET /api/species?q= (a new term each time)': 2, 'GET /api/species?q= (accented, hybrid)': 2,
})
process.exit(ok ? 0 : 1)
