// The engine's own time for a document, in this process (no HTTP, no JSON): run by score.mjs through tsx, with
// the document and its facts in a file. Prints the median of repeated whole scores, fresh each time as the server
// scores, and of re-scores with the editor's memo after moving one plant.
import { readFileSync } from 'node:fs'
import { createScoreMemo, scoreYard } from '../../shared/utils/score'
import type { YardDocument } from '../../shared/schemas/yard-document'
import type { SpeciesFacts } from '../../shared/types/species'

const { doc, facts: raw, goal } = JSON.parse(readFileSync(process.argv[2]!, 'utf8')) as { doc: YardDocument; facts: Record<string, SpeciesFacts>; goal: number }
const facts = new Map(Object.entries(raw))
const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!
const time = (f: () => unknown, n: number) => {
  for (let i = 0; i < 5; i++) f()
  const out: number[] = []
  for (let i = 0; i < n; i++) { const t = performance.now(); f(); out.push(performance.now() - t) }
  return median(out)
}
const whole = time(() => scoreYard(doc, facts, goal, doc.region), 40)
const memo = createScoreMemo()
scoreYard(doc, facts, goal, doc.region, memo)
const points = doc.plantings.filter((p) => p.x !== undefined)
let k = 0
const edit = time(() => { const p = points[k++ % points.length]!; p.x = p.x! + (k % 2 ? 0.15 : -0.15); scoreYard(doc, facts, goal, doc.region, memo) }, 200)
console.log(JSON.stringify({ whole, edit }))
