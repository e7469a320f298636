// POST /api/score, as the editor calls it: the whole 150-planting and 1,000-planting / 100-area yards (the first
// score when a yard opens), then one change after another to the big yard (every edit after that), beside
// GET /api/health measured in the same run. Target: a change to the big yard ≤ 2× the health route's median.
import { measure, report, health, signIn } from './_measure.mjs'

const rect = (x, y, w, h) => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]
const SPECIES = ['Asclepias tuberosa', 'Echinacea purpurea', 'Carex pensylvanica', 'Berberis thunbergii', 'Plantago imaginaria', null]

// A lot of lawn with a house, a drive along the lot line, paths, and a grid of beds holding drifts and clumps;
// two paths cross beds so the ground layer needs real clipping, as drawn yards do.
function yard({ width, depth, beds, plantings }) {
  const areas = [
    { id: 'house', kind: 'building', z: 10, points: rect(width * 0.3, depth * 0.4, width * 0.4, depth * 0.2) },
    { id: 'drive', kind: 'paving', z: 9, points: rect(width - 4, depth * 0.5, 4, depth * 0.5) },
  ]
  const cols = Math.ceil(Math.sqrt(beds))
  const cell = Math.min(width, depth * 0.4) / cols
  const bedRings = []
  for (let i = 0; i < beds; i++) {
    const ring = rect((i % cols) * cell + 0.5, Math.floor(i / cols) * cell + 0.5, cell - 1, cell - 1)
    bedRings.push(ring)
    areas.push({ id: `bed${i}`, kind: 'bed', z: 5, points: ring })
  }
  areas.push({ id: 'path1', kind: 'paving', z: 9, points: rect(0, cell * 1.5, width * 0.6, 1) })
  areas.push({ id: 'path2', kind: 'paving', z: 9, points: rect(cell * 2.5, 0, 1, depth * 0.35) })
  const list = [
    { id: 'lawn', species: 'Poa pratensis', z: 0, points: rect(0, 0, width, depth), spacing: null, height: 0.08 },
    { id: 'oak', species: 'Quercus alba', x: width * 0.8, y: depth * 0.2, count: 1, spread: 12, height: 20 },
    { id: 'maple', species: 'Acer platanoides', x: width * 0.2, y: depth * 0.8, count: 1, spread: 9, height: 14 },
  ]
  for (let i = 0; list.length < plantings; i++) {
    const bed = bedRings[i % beds]
    const [x0, y0] = bed[0]
    const w = bed[1][0] - x0
    const species = SPECIES[i % SPECIES.length]
    if (i < beds) list.push({ id: `drift${i}`, species: 'Carex pensylvanica', z: 6, points: rect(x0 + w * 0.5, y0, w * 0.5, w * 0.5), spacing: 0.3, height: 0.2 })
    else list.push({ id: `p${i}`, species, x: x0 + ((i * 7) % 10) / 10 * w * 0.5 + 0.3, y: y0 + ((i * 3) % 10) / 10 * w + 0.1, count: 1 + (i % 5), spread: 0.5, height: 0.7 })
  }
  return { format: 'wildward.yard/1', region: 'US-OH', units: 'ft', boundary: rect(0, 0, width, depth), areas, plantings: list }
}

const small = yard({ width: 18, depth: 36, beds: 13, plantings: 150 })
const big = yard({ width: 60, depth: 90, beds: 96, plantings: 1000 })
if (big.areas.length !== 100 || big.plantings.length !== 1000 || small.plantings.length !== 150) throw new Error('bench yards have the wrong size')

const cookie = await signIn('homeowner@example.org')
const headers = { 'content-type': 'application/json', cookie }
const post = (doc) => {
  const body = JSON.stringify(doc)
  return () => ['/api/score', { method: 'POST', headers, body }]
}

// What the editor sends after each edit once it has a first answer: the change against the last answer's basis.
// Each request nudges another plant half a foot and back, as dragging does, chained on the previous answer.
// A bed nudged the same way re-measures the lawn and drifts it cuts, so it is reported beside (no target).
function edits(doc, what = 'plant') {
  let basis = null
  let k = 0
  const points = doc.plantings.filter((p) => p.x !== undefined)
  const beds = doc.areas.filter((a) => a.kind === 'bed')
  const make = () => {
    const list = what === 'plant' ? points : beds
    const e = list[k % list.length]
    const dx = Math.floor(k / list.length) % 2 ? 0 : 0.1524
    k++
    const changes = what === 'plant'
      ? { plantings: { upsert: [{ ...e, x: e.x + dx }] } }
      : { areas: { upsert: [{ ...e, points: e.points.map(([x, y]) => [x + dx, y]) }] } }
    return ['/api/score', { method: 'POST', headers, body: JSON.stringify({ basis, changes }) }]
  }
  const after = (status, bytes) => { if (status === 200) basis = JSON.parse(Buffer.from(bytes).toString()).basis }
  return { make, after, start: async () => { const r = await fetch(`${process.env.WW_BASE_URL}/api/score`, { method: 'POST', headers, body: JSON.stringify(doc) }); basis = (await r.json()).basis } }
}
const bigEdits = edits(big)
const bedEdits = edits(big, 'bed')
await bigEdits.start()
const probe = await fetch(`${process.env.WW_BASE_URL}${bigEdits.make()[0]}`, bigEdits.make()[1])
const probeBytes = (await probe.arrayBuffer()).byteLength
if (probe.status !== 200) throw new Error(`changes: ${probe.status}`)

// Two phases, each of rounds that alternate its requests with the health route, so that load from anything else
// on the machine falls on all of them alike; each figure is the median of its rounds' medians. Edits and whole
// documents are measured apart because the whole-document posts leave megabytes of garbage that the server's
// collector clears during whatever request comes next.
const ROUNDS = 5
const CHANGE = 'POST /api/score (a change, 1,000 plantings)'
const HEALTH = { name: 'GET /api/health', make: health }
const phases = [
  ['Score engine: each edit (after the yard is open)', [
    HEALTH,
    // each round opens the yard again first (one whole post), as the editor does, then edits it
    { name: CHANGE, make: bigEdits.make, after: bigEdits.after, before: bigEdits.start },
    { name: 'POST /api/score (a bed moved, 1,000 plantings)', make: bedEdits.make, after: bedEdits.after, before: bedEdits.start },
  ]],
  ['Score engine: opening a yard (the whole document)', [
    HEALTH,
    { name: 'POST /api/score (150 plantings)', make: post(small) },
    { name: 'POST /api/score (1,000 plantings, 100 areas)', make: post(big) },
  ]],
]
const mid = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]
console.log(`bodies: ${(JSON.stringify(small).length / 1024).toFixed(0)} KiB and ${(JSON.stringify(big).length / 1024).toFixed(0)} KiB whole; a change ${bigEdits.make()[1].body.length} B in, ~${(probeBytes / 1024).toFixed(1)} KiB out; ${ROUNDS} alternating rounds`)
let ok = true
for (const [title, cases] of phases) {
  const runs = cases.map(() => [])
  for (let round = 0; round < ROUNDS; round++) {
    for (const [i, c] of cases.entries()) {
      await c.before?.()
      runs[i].push(await measure(c.name, c.make, { requests: 60, warmup: round === 0 ? 20 : 5, seconds: 8, after: c.after }))
    }
  }
  const [base, ...rows] = runs.map((r, i) => ({ name: cases[i].name, median: mid(r.map((x) => x.median)), rps: mid(r.map((x) => x.rps)), n: r.reduce((s, x) => s + x.n, 0) }))
  ok = report(title, base, rows, { [CHANGE]: 2 }) && ok
}
if (!ok) console.log('target not met (reported, not failed: a benchmark, not a timed test)')
