// Shared measuring for bench cases: a sequential loop of fetches (one request at a time, so the median is the
// route's own latency), then a short concurrent burst for throughput. Bounded in count and time; loopback only.
export const BASE_URL = process.env.WW_BASE_URL

export async function signIn(email, password = 'wildward-demo') {
  const r = await fetch(`${BASE_URL}/api/auth/login`, { method: 'POST', headers: { 'content-type': 'application/json' }, body: JSON.stringify({ email, password }) })
  if (r.status !== 200) throw new Error(`sign-in failed: ${r.status}`)
  return r.headers.getSetCookie().map((c) => c.split(';')[0]).join('; ')
}

function median(xs) {
  const s = [...xs].sort((a, b) => a - b)
  return s[Math.floor(s.length / 2)]
}

/**
 * Measures one request shape: `make()` returns [path, init]; `after(status, bytes)`, when given, sees each answer
 * outside the timed part (a case that chains requests reads what it needs there).
 */
export async function measure(name, make, { requests = 200, warmup = 20, concurrency = 4, seconds = 20, after } = {}) {
  for (let i = 0; i < warmup; i++) {
    const [p, init] = make()
    const r = await fetch(BASE_URL + p, init)
    const bytes = await r.arrayBuffer()
    if (r.status >= 400) throw new Error(`${name}: ${r.status} ${Buffer.from(bytes).toString()}`)
    after?.(r.status, bytes)
  }
  const times = []
  const until = Date.now() + seconds * 1000
  for (let i = 0; i < requests && Date.now() < until; i++) {
    const [p, init] = make()
    const t = performance.now()
    const r = await fetch(BASE_URL + p, init)
    const bytes = await r.arrayBuffer()
    times.push(performance.now() - t)
    if (r.status >= 400) throw new Error(`${name}: ${r.status} ${Buffer.from(bytes).toString()}`)
    after?.(r.status, bytes)
  }
  const burst = Math.min(requests, 200)
  let done = 0
  const t0 = performance.now()
  await Promise.all(Array.from({ length: concurrency }, async () => {
    while (done < burst) {
      done++
      const [p, init] = make()
      const r = await fetch(BASE_URL + p, init)
      after?.(r.status, await r.arrayBuffer())
    }
  }))
  const rps = burst / ((performance.now() - t0) / 1000)
  return { name, median: median(times), rps, n: times.length }
}

/** Prints rows beside the health baseline measured in the same run. */
export function report(title, baseline, rows, targets = {}) {
  console.log(`\n${title}`)
  const line = (r) => `${r.name.padEnd(44)} median ${r.median.toFixed(2).padStart(8)} ms  ${r.rps.toFixed(0).padStart(6)} req/s  ratio ${(r.median / baseline.median).toFixed(2)}×`
  console.log(line(baseline))
  let ok = true
  for (const r of rows) {
    const target = targets[r.name]
    const ratio = r.median / baseline.median
    const verdict = target ? (ratio <= target ? `  (target ≤ ${target}×: met)` : `  (target ≤ ${target}×: NOT met)`) : ''
    if (target && ratio > target) ok = false
    console.log(line(r) + verdict)
  }
  return ok
}

export const health = () => ['/api/health', {}]
