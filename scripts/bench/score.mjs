// POST /api/score, stateless: each request sends a whole yard and gets its whole score. Realistic yards
// (scripts/bench/_yards.mjs) of 150 plantings and of 1,000 plantings / 100 areas, beside GET /api/health in the
// same run; then the engine's own time for the same documents in-process, so the figures show what is HTTP and
// JSON and what is geometry. Targets: 150 plantings ≤ 3× health, 1,000 / 100 ≤ 10×.
import { spawnSync } from 'node:child_process'
import { writeFileSync, mkdtempSync } from 'node:fs'
import { tmpdir } from 'node:os'
import { join } from 'node:path'
import { measure, report, health, signIn, BASE_URL } from './_measure.mjs'
import { realisticYard, SMALL_YARD, LARGE_YARD } from './_yards.mjs'

const small = realisticYard(SMALL_YARD)
const big = realisticYard(LARGE_YARD)
const cookie = await signIn('homeowner@example.org')
const headers = { 'content-type': 'application/json', cookie }
const post = (doc) => {
  const body = JSON.stringify(doc)
  return () => ['/api/score', { method: 'POST', headers, body }]
}
for (const doc of [small, big]) {
  const r = await fetch(`${BASE_URL}/api/score`, { method: 'POST', headers, body: JSON.stringify(doc) })
  if (r.status !== 200) throw new Error(`bench yard refused: ${r.status} ${await r.text()}`)
}

// rounds that alternate the cases with the health route, so load from anything else falls on all alike
const ROUNDS = 5
const SMALL = 'POST /api/score (150 plantings)'
const BIG = 'POST /api/score (1,000 plantings, 100 areas)'
const cases = [{ name: 'GET /api/health', make: health }, { name: SMALL, make: post(small) }, { name: BIG, make: post(big) }]
const runs = cases.map(() => [])
for (let round = 0; round < ROUNDS; round++) {
  for (const [i, c] of cases.entries()) runs[i].push(await measure(c.name, c.make, { requests: 40, warmup: round === 0 ? 15 : 3, seconds: 8 }))
}
const mid = (xs) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]
console.log(`bodies: ${(JSON.stringify(small).length / 1024).toFixed(0)} KiB and ${(JSON.stringify(big).length / 1024).toFixed(0)} KiB; ${ROUNDS} alternating rounds`)
const [base, ...rows] = runs.map((r, i) => ({ name: cases[i].name, median: mid(r.map((x) => x.median)), rps: mid(r.map((x) => x.rps)), n: r.reduce((s, x) => s + x.n, 0) }))
const ok = report('Score engine over HTTP: a whole document each request', base, rows, { [SMALL]: 3, [BIG]: 10 })

// the same documents through the engine in this machine's Node.js, with the facts the server would load
console.log('\nScore engine in-process (no HTTP, no JSON): median ms')
const dir = mkdtempSync(join(tmpdir(), 'wildward-bench-'))
for (const [label, doc] of [['150 plantings', small], ['1,000 plantings, 100 areas', big]]) {
  const names = [...new Set(doc.plantings.map((p) => p.species).filter(Boolean))]
  const inputs = await (await fetch(`${BASE_URL}/api/species/facts`, { method: 'POST', headers, body: JSON.stringify({ region: doc.region, names }) })).json()
  const file = join(dir, 'doc.json')
  writeFileSync(file, JSON.stringify({ doc, facts: inputs.facts, goal: inputs.goal }))
  const r = spawnSync('npx', ['tsx', join('scripts', 'bench', '_engine.ts'), file], { encoding: 'utf8' })
  if (r.status !== 0) { console.log(`${label}: engine run failed\n${r.stderr}`); continue }
  const t = JSON.parse(r.stdout.trim().split('\n').pop())
  console.log(`${label.padEnd(30)} whole document ${t.whole.toFixed(2).padStart(7)} ms   after moving one plant (editor's memo) ${t.edit.toFixed(2).padStart(6)} ms`)
}
if (!ok) console.log('target not met (reported, not failed: a benchmark, not a timed test)')
