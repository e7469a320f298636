// The yard editor in Chromium: drawing, the score worked out in the browser against the route, undo/redo, conflicts between
// two tabs, unsaved work kept across a reload, and a refused non-image upload.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { readFileSync } from 'node:fs'
import { launch, newContext, type Browser, type BrowserContext, type Page } from '../support/browser'
import mysql from 'mysql2/promise'

/** Shares a yard directly in the database (the sharing routes belong to another part of the app). */
async function addMember(yardId: number, userId: number, role: 'viewer' | 'editor') {
  const db = await mysql.createConnection(process.env.DATABASE_URL!)
  try { await db.execute('INSERT INTO yard_members (yard_id, user_id, role) VALUES (?, ?, ?)', [yardId, userId, role]) } finally { await db.end() }
}

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

async function signedInContext(): Promise<BrowserContext> {
  const { context } = await newContext(browser)
  const email = `editor-${Date.now()}-${Math.random().toString(36).slice(2, 6)}@example.test`
  const r = await context.request.post('/api/auth/register', { data: { email, name: 'Editor Test', password: 'a-long-e2e-password' } })
  expect(r.status()).toBe(201)
  return context
}
async function newYard(context: BrowserContext, document?: unknown): Promise<number> {
  const r = await context.request.post('/api/yards', { data: { name: 'Test yard', region: 'US-OH', ...(document ? { document } : {}) } })
  expect(r.status()).toBe(201)
  return (await r.json()).id
}
async function openEditor(page: Page, id: number) {
  await page.goto(`/yards/${id}`)
  await page.locator('[data-test=yard-canvas] canvas').first().waitFor()
  await expect.poll(() => page.locator('[data-test=save-state]').getAttribute('data-state')).toBe('saved')
}
async function canvasBox(page: Page) {
  const box = await page.locator('[data-test=yard-canvas]').boundingBox()
  if (!box) throw new Error('no canvas')
  return box
}
/** Drags on the plan between two points given as fractions of its size. */
async function dragOnPlan(page: Page, from: [number, number], to: [number, number]) {
  const b = await canvasBox(page)
  await page.mouse.move(b.x + b.width * from[0], b.y + b.height * from[1])
  await page.mouse.down()
  await page.mouse.move(b.x + b.width * ((from[0] + to[0]) / 2), b.y + b.height * ((from[1] + to[1]) / 2), { steps: 4 })
  await page.mouse.move(b.x + b.width * to[0], b.y + b.height * to[1], { steps: 4 })
  await page.mouse.up()
}
async function clickOnPlan(page: Page, at: [number, number]) {
  const b = await canvasBox(page)
  await page.mouse.click(b.x + b.width * at[0], b.y + b.height * at[1])
}
const elementCount = (page: Page) => page.locator('[data-test=element-list] [data-element]').count()
async function savedDocument(context: BrowserContext, id: number) {
  return (await (await context.request.get(`/api/yards/${id}`)).json()).document
}

describe('the yard editor', () => {
  it('draws a lot, a lawn, a bed over it and four plants, and shows the shares the score route gives', async () => {
    const context = await signedInContext()
    // three natives and one introduced species from the catalogue, whatever it holds
    const list = await (await context.request.get('/api/species?region=US-OH&q=a&page=1')).json() as { items: Array<{ scientificName: string; status: string; layer: string }> }
    const more = await (await context.request.get('/api/species?region=US-OH&q=e&page=1')).json() as typeof list
    // the search ranks the region's natives first, so the introduced ones are asked for by status
    const introducedList = await (await context.request.get('/api/species?region=US-OH&status=introduced&q=a&page=1')).json() as typeof list
    const all = [...list.items, ...more.items, ...introducedList.items]
    // plain binomials, so that typing the name finds exactly that species
    const binomial = (s: { scientificName: string }) => /^[A-Z][a-z-]+ [a-z-]+$/.test(s.scientificName)
    // ...that the search box finds by their full name, as a person would type it
    const findable = async (name: string) => ((await (await context.request.get(`/api/species?region=US-OH&q=${encodeURIComponent(name)}&page=1`)).json()).items ?? [])
      .slice(0, 10).some((s: { scientificName: string }) => s.scientificName === name)
    const pick = async (status: string, n: number) => {
      const out: string[] = []
      for (const s of all.filter((x) => x.status === status && x.layer !== 'tree' && binomial(x))) {
        if (out.length === n) break
        if (!out.includes(s.scientificName) && await findable(s.scientificName)) out.push(s.scientificName)
      }
      return out
    }
    const natives = await pick('native', 3)
    const introduced = (await pick('introduced', 1))[0]
    expect(natives.length).toBe(3)
    expect(introduced).toBeTruthy()

    const id = await newYard(context)
    const page = await context.newPage()
    // the editor scores in the browser: it never asks the server to score
    const scoreRequests: string[] = []
    page.on('request', (r) => { if (r.url().endsWith('/api/score')) scoreRequests.push(r.url()) })
    await openEditor(page, id)

    await page.locator('[data-tool=lot]').click()
    await dragOnPlan(page, [0.1, 0.1], [0.9, 0.9])
    await page.locator('[data-tool=lawn]').click()
    await dragOnPlan(page, [0.12, 0.12], [0.88, 0.88])
    await page.locator('[data-tool=bed]').click()
    await dragOnPlan(page, [0.2, 0.2], [0.6, 0.6])
    expect(await elementCount(page)).toBe(3)

    await page.locator('[data-tool=plant]').click()
    const spots: Array<[number, number]> = [[0.3, 0.3], [0.45, 0.3], [0.3, 0.5], [0.75, 0.75]]
    for (const [i, name] of [...natives, introduced!].entries()) {
      const search = page.locator('#plant-choice')
      await search.fill(name)
      await page.locator('[role=option]', { hasText: name }).first().click()
      await clickOnPlan(page, spots[i]!)
    }
    expect(await elementCount(page)).toBe(7)

    // the shares on screen equal POST /api/score on the exported document
    await expect.poll(() => page.locator('[data-test=save-state]').getAttribute('data-state'), { timeout: 10_000 }).toBe('saved')
    await page.waitForTimeout(800)
    const [download] = await Promise.all([page.waitForEvent('download'), page.locator('[data-test=export-json]').click()])
    const exported = JSON.parse(readFileSync((await download.path())!, 'utf8'))
    expect(exported.plantings).toHaveLength(5)
    expect(exported.areas.map((a: { kind: string }) => a.kind)).toEqual(['bed'])
    const score = await (await context.request.post('/api/score', { data: exported })).json()
    const pct = (s: number | null) => (s === null ? '—' : `${(s * 100).toFixed(1)} %`)
    for (const share of ['count', 'area', 'volume'] as const) {
      await expect.poll(() => page.locator(`[data-test=share-${share}]`).textContent()).toBe(pct(score.shares[share].share))
    }
    // the server has what the screen shows
    expect((await savedDocument(context, id)).plantings).toHaveLength(5)
    // each planting listed under its status, with its layer and size, as the server lists it
    expect(scoreRequests).toEqual([])
    await page.locator('[data-tab=score]').click()
    for (const line of score.plantings as Array<{ id: string; status: string; layer: string }>) {
      const row = page.locator(`[data-test=score-panel] [data-planting="${line.id}"]`)
      await expect.poll(() => row.count()).toBe(1)
      expect(await row.textContent()).toContain(line.layer)
    }
    expect(await page.locator('[data-test=score-panel] [data-planting]').count()).toBe(score.plantings.length)
    // the introduced plant is listed apart from the natives
    const introducedLine = (score.plantings as Array<{ id: string; status: string }>).find((l) => l.status === 'introduced')!
    const nativeLine = (score.plantings as Array<{ id: string; status: string }>).find((l) => l.status === 'native')!
    const sectionOf = (pid: string) => page.locator(`[data-test=score-panel] section:has([data-planting="${pid}"]) h3`).textContent()
    expect(await sectionOf(introducedLine.id)).not.toBe(await sectionOf(nativeLine.id))
    await page.locator('[data-tab=details]').click()

    // undo and redo
    await page.locator('[data-test=undo]').click()
    expect(await elementCount(page)).toBe(6)
    await page.keyboard.press('Control+Shift+Z')
    expect(await elementCount(page)).toBe(7)
    await page.keyboard.press('Control+z')
    await page.keyboard.press('Control+z')
    expect(await elementCount(page)).toBe(5)
    await page.locator('[data-test=redo]').click()
    expect(await elementCount(page)).toBe(6)
    await context.close()
  })

  it('selects and moves an element from the keyboard through the element list', async () => {
    const context = await signedInContext()
    const id = await newYard(context, { boundary: [[0, 0], [10, 0], [10, 10], [0, 10]], plantings: [{ id: 'p1', species: null, x: 5, y: 5, count: 1, spread: 1 }] })
    const page = await context.newPage()
    await openEditor(page, id)
    await page.locator('[data-element=lot]').focus()
    await page.keyboard.press('ArrowDown')
    await page.keyboard.press('Enter')
    expect(await page.locator('[data-element=p1]').getAttribute('aria-pressed')).toBe('true')
    await page.keyboard.press('Alt+ArrowRight')
    await page.keyboard.press('Alt+ArrowRight')
    await expect.poll(async () => (await savedDocument(context, id)).plantings[0].x, { timeout: 10_000 }).toBeCloseTo(5 + 2 * 0.1524, 6)
    // and with the pointer: the plant sits at the centre of the fitted lot; drag it right
    await page.locator('[data-tool=select]').click()
    await page.keyboard.press('0')
    const b = await canvasBox(page)
    await page.mouse.move(b.x + b.width / 2, b.y + b.height / 2)
    await page.mouse.down()
    await page.mouse.move(b.x + b.width / 2 + 60, b.y + b.height / 2, { steps: 6 })
    await page.mouse.move(b.x + b.width / 2 + 120, b.y + b.height / 2, { steps: 6 })
    await page.mouse.up()
    await expect.poll(async () => (await savedDocument(context, id)).plantings[0].x, { timeout: 10_000 }).toBeGreaterThan(5.5)
    expect((await savedDocument(context, id)).plantings[0].y).toBeCloseTo(5, 1)
    await context.close()
  })

  it('gives a stale second tab the conflict choice and loses nothing', async () => {
    const context = await signedInContext()
    const id = await newYard(context, { boundary: [[0, 0], [10, 0], [10, 10], [0, 10]] })
    const first = await context.newPage()
    const second = await context.newPage()
    await openEditor(first, id)
    await openEditor(second, id)

    await first.bringToFront()
    await first.locator('[data-tool=bed]').click()
    await dragOnPlan(first, [0.3, 0.3], [0.5, 0.5])
    await expect.poll(() => first.locator('[data-test=save-state]').getAttribute('data-state'), { timeout: 10_000 }).toBe('saved')

    await second.bringToFront()
    await second.locator('[data-tool=water]').click()
    await dragOnPlan(second, [0.55, 0.55], [0.7, 0.7])
    await second.locator('[data-test=conflict-dialog]').waitFor({ timeout: 10_000 })
    await second.locator('[data-test=keep-mine]').click()
    await second.waitForURL((u) => !u.pathname.endsWith(`/yards/${id}`))
    const copyId = Number(new URL(second.url()).pathname.split('/').pop())
    expect(copyId).not.toBe(id)
    // the first tab's bed is in the yard, the second tab's water is in the copy
    expect((await savedDocument(context, id)).areas.map((a: { kind: string }) => a.kind)).toEqual(['bed'])
    expect((await savedDocument(context, copyId)).areas.map((a: { kind: string }) => a.kind)).toEqual(['water'])

    // "load theirs" keeps this tab's version one undo away
    await first.locator('[data-tool=paving]').click()
    const third = await context.newPage()
    await openEditor(third, id)
    await third.locator('[data-tool=building]').click()
    await dragOnPlan(third, [0.6, 0.2], [0.8, 0.3])
    await expect.poll(() => third.locator('[data-test=save-state]').getAttribute('data-state'), { timeout: 10_000 }).toBe('saved')
    await first.bringToFront()
    await dragOnPlan(first, [0.2, 0.6], [0.4, 0.7])
    await first.locator('[data-test=conflict-dialog]').waitFor({ timeout: 10_000 })
    await first.locator('[data-test=load-theirs]').click()
    await expect.poll(async () => (await first.locator('[data-test=element-list] [data-element]').allTextContents()).join(' ')).toContain('Building')
    await first.keyboard.press('Control+z')
    await expect.poll(async () => (await first.locator('[data-test=element-list] [data-element]').allTextContents()).join(' ')).toContain('Paving')
    await context.close()
  })

  it('keeps unsaved work on the device across a reload, brings it back and saves it once the server answers', async () => {
    const context = await signedInContext()
    const id = await newYard(context, { boundary: [[0, 0], [10, 0], [10, 10], [0, 10]] })
    const page = await context.newPage()
    await openEditor(page, id)
    // the server cannot be reached for saves
    await page.route(`**/api/yards/${id}`, (route) => (route.request().method() === 'PUT' ? route.abort('internetdisconnected') : route.continue()))
    await page.locator('[data-tool=bed]').click()
    await dragOnPlan(page, [0.3, 0.3], [0.6, 0.6])
    await expect.poll(() => page.locator('[data-test=save-state]').getAttribute('data-state'), { timeout: 10_000 }).toBe('offline')
    // the edit is on the device already, so leaving does not ask; reload as a crash or a forced reload would
    await page.reload()
    await page.locator('[data-test=restored-edits]').waitFor()
    await expect.poll(() => elementCount(page)).toBe(2)
    expect((await savedDocument(context, id)).areas.length).toBe(0)
    await page.unroute(`**/api/yards/${id}`)
    await expect.poll(async () => (await savedDocument(context, id)).areas.length, { timeout: 15_000 }).toBe(1)
    await expect.poll(() => page.locator('[data-test=save-state]').getAttribute('data-state'), { timeout: 10_000 }).toBe('saved')
    await page.reload()
    await page.locator('[data-test=yard-canvas] canvas').first().waitFor()
    expect(await page.locator('[data-test=restored-edits]').count()).toBe(0)
    expect(await elementCount(page)).toBe(2)
    await context.close()
  })

  it('refuses a renamed non-image upload with a clear message, and accepts a real image', async () => {
    const context = await signedInContext()
    const id = await newYard(context, { boundary: [[0, 0], [10, 0], [10, 10], [0, 10]] })
    const page = await context.newPage()
    await openEditor(page, id)
    await page.locator('[data-tab=backdrop]').click()
    await page.locator('[data-test=backdrop-file]').setInputFiles({ name: 'site-plan.png', mimeType: 'image/png', buffer: Buffer.from('%PDF-1.7 this is a document, not a picture') })
    await expect.poll(() => page.locator('[data-test=backdrop-error]').textContent()).toMatch(/not a PNG, JPEG or WebP image/)
    const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==', 'base64')
    await page.locator('[data-test=backdrop-file]').setInputFiles({ name: 'aerial.png', mimeType: 'image/png', buffer: png })
    await expect.poll(async () => (await savedDocument(context, id)).backdrop?.uploadId, { timeout: 10_000 }).toBeTruthy()
    await context.close()
  })

  it('gives a viewer a read-only editor', async () => {
    const owner = await signedInContext()
    const id = await newYard(owner, { boundary: [[0, 0], [10, 0], [10, 10], [0, 10]] })
    const viewer = await signedInContext()
    const me = await (await viewer.request.get('/api/auth/me')).json()
    await addMember(id, me.user?.id ?? me.id, 'viewer')
    const page = await viewer.newPage()
    await page.goto(`/yards/${id}`)
    await page.locator('[data-test=yard-canvas] canvas').first().waitFor()
    expect(await page.locator('[data-tool=bed]').count()).toBe(0)
    expect(await page.locator('[data-test=undo]').count()).toBe(0)
    expect(await page.locator('[data-test=save-state]').textContent()).toContain('View only')
    // the keyboard cannot change it either
    await page.locator('[data-element=lot]').click()
    await page.keyboard.press('Delete')
    expect(await page.locator('[data-element=lot]').count()).toBe(1)
    await owner.close()
    await viewer.close()
  })
})
