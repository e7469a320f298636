// Editor speed: drag one plant in headless Chromium on a yard of 50 and one of 2,000 plantings, and print the
// median frame time of each and their ratio; then the JavaScript (gzip) the editor and the sign-in page ship.
import { gzipSync } from 'node:zlib'
import { chromium } from 'playwright-core'
import { BASE_URL, signIn } from './_measure.mjs'

const CHROMIUM_ARGS = ['--headless', '--no-sandbox', '--disable-gpu', '--disable-quic', '--no-first-run', '--disable-background-networking', '--disable-component-update', '--disable-sync']
const LOT = 120

function yardDocument(n) {
  const plantings = []
  const side = Math.ceil(Math.sqrt(n))
  for (let i = 0; i < n - 1; i++) {
    const col = i % side
    const row = Math.floor(i / side)
    plantings.push({ id: `p${i}`, species: ['Echinacea purpurea', 'Asclepias tuberosa', 'Berberis thunbergii', null][i % 4], x: 2 + (col * (LOT - 4)) / side, y: 2 + (row * (LOT - 4)) / side, count: 1, spread: 1 + (i % 3) * 0.5 })
  }
  // the plant to drag, alone at the centre of the lot (the editor opens fitted to the lot, so at the canvas centre)
  plantings.push({ id: 'target', species: 'Quercus alba', x: LOT / 2, y: LOT / 2, count: 1, spread: 2.5 })
  return {
    units: 'ft', boundary: [[0, 0], [LOT, 0], [LOT, LOT], [0, LOT]],
    areas: [{ id: 'a1', kind: 'building', z: 2, points: [[10, 10], [30, 10], [30, 25], [10, 25]] }, { id: 'a2', kind: 'bed', z: 1, points: [[70, 70], [100, 70], [100, 90], [70, 90]] }],
    plantings: plantings.filter((p) => p.id === 'target' || Math.hypot(p.x - LOT / 2, p.y - LOT / 2) > 4),
  }
}

async function createYard(cookie, n) {
  const r = await fetch(`${BASE_URL}/api/yards`, { method: 'POST', headers: { 'content-type': 'application/json', cookie }, body: JSON.stringify({ name: `Bench ${n}`, region: 'US-OH', document: yardDocument(n) }) })
  if (r.status !== 201) throw new Error(`create yard: ${r.status} ${await r.text()}`)
  const body = await r.json()
  return { id: body.id, plantings: body.document.plantings.length }
}

function cookiesFor(cookie) {
  const url = new URL(BASE_URL)
  return cookie.split('; ').map((pair) => { const i = pair.indexOf('='); return { name: pair.slice(0, i), value: pair.slice(i + 1), domain: url.hostname, path: '/' } })
}

const median = (xs) => { const s = [...xs].sort((a, b) => a - b); return s[Math.floor(s.length / 2)] }
const p95 = (xs) => { const s = [...xs].sort((a, b) => a - b); return s[Math.floor(s.length * 0.95)] }

async function dragFrames(browser, cookie, yardId) {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
  await context.addCookies(cookiesFor(cookie))
  const page = await context.newPage()
  await page.goto(`${BASE_URL}/yards/${yardId}`)
  await page.locator('[data-test=yard-canvas] canvas').first().waitFor()
  // let the first score arrive and the plan settle
  await page.waitForFunction(() => document.querySelector('[data-test=score-summary] dl, [data-test=score-unavailable]'), null, { timeout: 30_000 })
  await page.waitForTimeout(1000)
  const box = await page.locator('[data-test=yard-canvas]').boundingBox()
  const cx = box.x + box.width / 2
  const cy = box.y + box.height / 2
  await page.evaluate(() => {
    window.__frames = []
    let last = performance.now()
    const tick = (t) => { window.__frames.push(t - last); last = t; if (window.__recording) requestAnimationFrame(tick) }
    window.__recording = true
    requestAnimationFrame(tick)
  })
  await page.mouse.move(cx, cy)
  await page.mouse.down()
  for (let i = 1; i <= 150; i++) {
    await page.mouse.move(cx + Math.sin(i / 12) * 160, cy + Math.cos(i / 15) * 90 - 90)
    await page.waitForTimeout(8)
  }
  await page.mouse.up()
  if (process.env.WW_BENCH_SHOT) await page.screenshot({ path: `${process.env.WW_BENCH_SHOT}-${yardId}.png` })
  const frames = await page.evaluate(() => { window.__recording = false; return window.__frames.slice(2) })
  // the drag really moved the plant (autosave carries it to the server)
  let target
  for (let i = 0; i < 40; i++) {
    await page.waitForTimeout(250)
    const doc = await (await fetch(`${BASE_URL}/api/yards/${yardId}`, { headers: { cookie } })).json()
    target = doc.document.plantings.find((p) => p.id === 'target')
    if (Math.hypot(target.x - LOT / 2, target.y - LOT / 2) > 0.5) break
  }
  await context.close()
  return { median: median(frames), p95: p95(frames), frames: frames.length, moved: Math.hypot(target.x - LOT / 2, target.y - LOT / 2) > 0.5 }
}

async function shippedJs(browser, path, cookie) {
  const context = await browser.newContext({ viewport: { width: 1440, height: 900 } })
  if (cookie) await context.addCookies(cookiesFor(cookie))
  const page = await context.newPage()
  const bodies = []
  page.on('response', async (res) => {
    if (res.request().resourceType() === 'script' || /\.m?js(\?|$)/.test(res.url())) bodies.push(res.body().then((b) => ({ url: res.url(), gz: gzipSync(b).length })).catch(() => null))
  })
  await page.goto(`${BASE_URL}${path}`, { waitUntil: 'networkidle' })
  if (path.startsWith('/yards/')) await page.locator('[data-test=yard-canvas] canvas').first().waitFor()
  await page.waitForTimeout(1000)
  const files = (await Promise.all(bodies)).filter(Boolean)
  await context.close()
  return { kb: files.reduce((s, f) => s + f.gz, 0) / 1024, files: new Set(files.map((f) => f.url)).size }
}

const cookie = await signIn('homeowner@example.org')
const small = await createYard(cookie, 50)
const large = await createYard(cookie, 2000)
const browser = await chromium.launch({ executablePath: '/usr/bin/chromium', args: CHROMIUM_ARGS })
try {
  // a warm-up run, so the first measurement does not pay for compiling the page's code
  await dragFrames(browser, cookie, (await createYard(cookie, 50)).id)
  const a = await dragFrames(browser, cookie, small.id)
  const b = await dragFrames(browser, cookie, large.id)
  const editorJs = await shippedJs(browser, `/yards/${small.id}`, cookie)
  const loginJs = await shippedJs(browser, '/login')
  const ratio = b.median / a.median
  const verdict = (ok) => (ok ? 'met' : 'NOT met')
  console.log('\nYard editor: dragging one plant in headless Chromium (median frame time, requestAnimationFrame intervals)')
  console.log(`${`${small.plantings} plantings`.padEnd(20)} median ${a.median.toFixed(2).padStart(7)} ms (95th percentile ${a.p95.toFixed(1)} ms) over ${a.frames} frames${a.moved ? '' : '  (the plant did NOT move)'}`)
  console.log(`${`${large.plantings} plantings`.padEnd(20)} median ${b.median.toFixed(2).padStart(7)} ms (95th percentile ${b.p95.toFixed(1)} ms) over ${b.frames} frames${b.moved ? '' : '  (the plant did NOT move)'}  (target ≤ 18 ms: ${verdict(b.median <= 18)})`)
  console.log(`${'ratio'.padEnd(20)} ${ratio.toFixed(2)}×  (target ≤ 1.3×: ${verdict(ratio <= 1.3)})`)
  console.log('\nShipped JavaScript (gzip, every script the page loads)')
  console.log(`${'editor page'.padEnd(20)} ${editorJs.kb.toFixed(1).padStart(7)} KB in ${editorJs.files} files  (target ≤ 350 KB: ${verdict(editorJs.kb <= 350)})`)
  console.log(`${'sign-in page'.padEnd(20)} ${loginJs.kb.toFixed(1).padStart(7)} KB in ${loginJs.files} files  (target ≤ 120 KB: ${verdict(loginJs.kb <= 120)})`)
  if (!a.moved || !b.moved) process.exitCode = 1
} finally {
  await browser.close()
}
