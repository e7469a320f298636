// The editor scores in the browser and the server scores saved yards, with the same engine: for the demo
// yards and a large generated yard, the figures the editor shows equal GET /api/yards/[id]/score.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { launch, newContext, signIn, type Browser, type Page } from '../support/browser'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

interface Score {
  shares: Record<'count' | 'area' | 'volume', { share: number | null }>
  byStatus: Record<string, { count: number; area: number; volume: number }>
  moves: Array<{ share: string; kind: string; amount: number; text: string }>
  warnings: unknown[]
}

/** The figures on screen: shares, totals by status, moves and the number of notes. */
async function editorFigures(page: Page) {
  await page.locator('[data-tab=score]').click()
  return page.evaluate(() => {
    const attr = (sel: string, name: string) => [...document.querySelectorAll(sel)].map((e) => e.getAttribute(name))
    const shares = Object.fromEntries(['count', 'area', 'volume'].map((k) => [k, document.querySelector(`[data-test=share-${k}]`)?.getAttribute('data-share') ?? null]))
    const byStatus = Object.fromEntries([...document.querySelectorAll('[data-test^=status-]')].map((row) => [row.getAttribute('data-test')!.slice(7), [row.getAttribute('data-count'), row.getAttribute('data-area'), row.getAttribute('data-volume')].map(Number)]))
    const warnings = Number(document.querySelector('[data-test=score-warnings]')?.getAttribute('data-warnings') ?? 0)
    return { shares, byStatus, moves: attr('[data-move]', 'data-move'), warnings }
  })
}

const expected = (s: Score) => ({
  shares: Object.fromEntries(Object.entries(s.shares).map(([k, v]) => [k, v.share === null ? '' : String(v.share)])),
  byStatus: Object.fromEntries(Object.entries(s.byStatus).map(([k, t]) => [k, [t.count, t.area, t.volume]])),
  moves: s.moves.map((m) => `${m.share} ${m.kind} ${m.amount} ${m.text}`),
  warnings: s.warnings.length,
})

async function compare(page: Page, yardId: number) {
  await page.goto(`/yards/${yardId}`)
  await page.locator('[data-test=share-count]').waitFor()
  const server = await (await page.request.get(`/api/yards/${yardId}/score`)).json() as Score
  await expect.poll(async () => (await editorFigures(page)).shares, { timeout: 15_000 }).toEqual(expected(server).shares)
  expect(await editorFigures(page)).toEqual(expected(server))
}

// a big yard drawn over the whole lot: trees across the lot line, ground plants on the lawn and in beds
function largeYard(n: number, areas: number) {
  const lot = 60
  const rnd = (() => { let s = 42; return () => ((s = (s * 1103515245 + 12345) % 2147483648) / 2147483648) })()
  const species = ['Quercus alba', 'Acer platanoides', 'Cornus sericea', 'Berberis thunbergii', 'Echinacea purpurea', 'Asclepias tuberosa', 'Carex pensylvanica', null]
  const beds = Array.from({ length: areas }, (_, i) => {
    const x = rnd() * (lot - 6), y = rnd() * (lot - 6), w = 1 + rnd() * 5, h = 1 + rnd() * 5
    return { id: `a${i}`, kind: i % 10 === 0 ? 'paving' : 'bed', z: 2 + (i % 3), points: [[x, y], [x + w, y], [x + w, y + h], [x, y + h]] }
  })
  const plantings: Array<Record<string, unknown>> = [{ id: 'lawn', species: 'Poa pratensis', z: 1, spacing: null, height: 0.1, points: [[2, 2], [lot - 2, 2], [lot - 2, lot - 2], [2, lot - 2]] }]
  for (let i = 0; i < n - 1; i++) {
    const sp = species[i % species.length]!
    plantings.push(i % 25 === 0
      ? { id: `d${i}`, species: 'Carex pensylvanica', z: 3, spacing: 0.4, points: [[rnd() * lot, rnd() * lot], [rnd() * lot, rnd() * lot], [rnd() * lot, rnd() * lot]].sort((a, b) => a[0]! - b[0]!) }
      : { id: `p${i}`, species: sp, x: -3 + rnd() * (lot + 6), y: -3 + rnd() * (lot + 6), count: 1 + (i % 3), spread: sp === 'Quercus alba' || sp === 'Acer platanoides' ? 6 + rnd() * 6 : 0.3 + rnd() * 1.5 })
  }
  return { units: 'ft', region: 'US-OH', boundary: [[0, 0], [lot, 0], [lot, lot], [0, lot]], areas: beds, plantings }
}

describe("the editor's score", () => {
  it("equals the server's for each demo yard", async () => {
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await signIn(page, 'homeowner@example.org')
    const yards = (await (await page.request.get('/api/yards')).json()).items as Array<{ id: number }>
    expect(yards.length).toBeGreaterThan(0)
    for (const y of yards) await compare(page, y.id)
    await context.close()
  })

  it("equals the server's for a large generated yard, also after an edit is saved", async () => {
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await signIn(page, 'homeowner@example.org')
    const r = await page.request.post('/api/yards', { data: { name: 'Large generated yard', region: 'US-OH', document: largeYard(1000, 100) } })
    expect(r.status()).toBe(201)
    const { id } = await r.json()
    await compare(page, id)
    // an edit scored in the browser, saved, and scored by the server: the lot nudged half a foot, which changes
    // what of every tree across the lot line counts
    await page.locator('[data-element=lot]').focus()
    await page.keyboard.press('Enter')
    await page.keyboard.press('Alt+ArrowRight')
    await expect.poll(() => page.locator('[data-test=save-state]').getAttribute('data-state'), { timeout: 15_000 }).toBe('saved')
    const server = await (await page.request.get(`/api/yards/${id}/score`)).json() as Score
    expect(await editorFigures(page)).toEqual(expected(server))
    await context.close()
  })
})
