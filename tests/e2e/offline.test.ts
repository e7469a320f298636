// A site visit without a network: the yard opened once opens again offline (the browser's own offline mode),
// is edited, survives closing the tab, and is saved through the normal versioned save when the network
// returns; a save made meanwhile from another tab brings the conflict choice instead. Also visit notes and
// a photo taken offline, sent when the network returns.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { launch, newContext, outsideRequests, type Browser, type BrowserContext, type Page } from '../support/browser'
import { newHomeowner } from '../support/http'
import { visitTo } from '../api/advice/fixtures'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

const PASSWORD = 'a-long-e2e-password'
async function register(): Promise<{ context: BrowserContext; requests: string[]; email: string }> {
  const { context, requests } = await newContext(browser, { viewport: { width: 1024, height: 768 } })
  const email = `offline-${Date.now()}-${Math.random().toString(36).slice(2, 6)}@example.test`
  const r = await context.request.post('/api/auth/register', { data: { email, name: 'Offline Test', password: PASSWORD } })
  expect(r.status()).toBe(201)
  return { context, requests, email }
}
async function sameAccountElsewhere(email: string): Promise<BrowserContext> {
  const { context } = await newContext(browser)
  expect((await context.request.post('/api/auth/login', { data: { email, password: PASSWORD } })).status()).toBe(200)
  return context
}
async function newYard(context: BrowserContext): Promise<number> {
  const r = await context.request.post('/api/yards', { data: { name: 'Visit yard', region: 'US-OH', document: { units: 'ft', boundary: [[0, 0], [12, 0], [12, 12], [0, 12]], areas: [], plantings: [], lines: [] } } })
  expect(r.status()).toBe(201)
  return (await r.json()).id
}
const saveState = (page: Page) => page.locator('[data-test=save-state]').getAttribute('data-state')
const elementNames = async (page: Page) => (await page.locator('[data-test=element-list] [data-element]').allTextContents()).join(' ')
async function savedDocument(context: BrowserContext, id: number) {
  return (await (await context.request.get(`/api/yards/${id}`)).json()) as { version: number; document: { areas: Array<{ kind: string }> } }
}
async function waitForPlan(page: Page) {
  await page.locator('[data-test=yard-canvas] canvas').first().waitFor({ timeout: 30_000 })
}
/** Opens the editor online and waits until the service worker controls the page and keeps it for offline use. */
async function openOnceOnline(page: Page, id: number) {
  await page.goto(`/yards/${id}`)
  await waitForPlan(page)
  await expect.poll(() => saveState(page), { timeout: 15_000 }).toBe('saved')
  await expect.poll(() => page.evaluate(async () => !!navigator.serviceWorker.controller && !!(await caches.match(location.href))), { timeout: 30_000 }).toBe(true)
}
async function drawOnPlan(page: Page, tool: string, from: [number, number], to: [number, number]) {
  await page.locator(`[data-tool=${tool}]`).click()
  const b = (await page.locator('[data-test=yard-canvas]').boundingBox())!
  await page.mouse.move(b.x + b.width * from[0], b.y + b.height * from[1])
  await page.mouse.down()
  await page.mouse.move(b.x + b.width * (from[0] + to[0]) / 2, b.y + b.height * (from[1] + to[1]) / 2, { steps: 4 })
  await page.mouse.move(b.x + b.width * to[0], b.y + b.height * to[1], { steps: 4 })
  await page.mouse.up()
}
/** The edit this device keeps for a yard, read straight from IndexedDB. */
function keptOnDevice(page: Page, id: number) {
  return page.evaluate((yardId) => new Promise<{ unsaved: boolean; areas: number } | null>((resolve) => {
    const open = indexedDB.open('wildward-offline')
    open.onsuccess = () => {
      const tx = open.result.transaction('pending', 'readonly')
      const get = tx.objectStore('pending').get(`yard:${yardId}`)
      get.onsuccess = () => resolve(get.result ? { unsaved: get.result.unsaved, areas: get.result.document.areas.length } : null)
      get.onerror = () => resolve(null)
    }
    open.onerror = () => resolve(null)
  }), id)
}

/** Online visit → offline reload → an edit → the tab closed → a new tab offline. Returns that new tab. */
async function editOfflineAcrossATab(context: BrowserContext, id: number): Promise<Page> {
  const page = await context.newPage()
  await openOnceOnline(page, id)
  await context.setOffline(true)
  // really offline: a request the worker does not keep fails
  expect(await page.evaluate(() => fetch('/api/health').then(() => 'reached', () => 'failed'))).toBe('failed')
  await page.reload()
  await waitForPlan(page)
  await page.locator('[data-test=offline-bar]').waitFor()
  expect(await page.locator('[data-test=offline-bar]').textContent()).toContain('Offline — changes are kept on this device')
  await drawOnPlan(page, 'bed', [0.3, 0.3], [0.6, 0.6])
  await expect.poll(() => elementNames(page), { timeout: 15_000 }).toContain('Bed')
  await expect.poll(() => saveState(page), { timeout: 10_000 }).toBe('offline')
  await expect.poll(() => keptOnDevice(page, id), { timeout: 15_000 }).toEqual({ unsaved: true, areas: 1 })
  await page.close()

  const again = await context.newPage()
  await again.goto(`/yards/${id}`)
  await waitForPlan(again)
  await again.locator('[data-test=restored-edits]').waitFor()
  await expect.poll(() => elementNames(again), { timeout: 15_000 }).toContain('Bed')
  await expect.poll(() => saveState(again), { timeout: 10_000 }).toBe('offline')
  return again
}

describe('the editor offline', () => {
  it('opens a yard again offline, keeps its edits across a closed tab, and saves them when the network returns', async () => {
    const { context, requests } = await register()
    const id = await newYard(context)
    const before = await savedDocument(context, id)
    const page = await editOfflineAcrossATab(context, id)
    // nothing reached the server while offline
    expect((await savedDocument(context, id)).version).toBe(before.version)
    await context.setOffline(false)
    await expect.poll(async () => (await savedDocument(context, id)).document.areas.map((a) => a.kind), { timeout: 20_000 }).toEqual(['bed'])
    await expect.poll(() => saveState(page), { timeout: 10_000 }).toBe('saved')
    expect((await savedDocument(context, id)).version).toBe(before.version + 1)
    await expect.poll(() => keptOnDevice(page, id), { timeout: 15_000 }).toEqual({ unsaved: false, areas: 1 })
    expect(await page.locator('[data-test=offline-bar]').count()).toBe(0)
    expect(outsideRequests(requests)).toEqual([])
    await context.close()
  })

  it('offers the conflict choice when the yard was saved from another tab meanwhile', async () => {
    const { context, email } = await register()
    const id = await newYard(context)
    const page = await editOfflineAcrossATab(context, id)
    expect((await savedDocument(context, id)).version).toBe(1)
    // meanwhile the same person saves from another browser that is online
    const other = await sameAccountElsewhere(email)
    const otherTab = await other.newPage()
    await otherTab.goto(`/yards/${id}`)
    await waitForPlan(otherTab)
    await drawOnPlan(otherTab, 'water', [0.2, 0.6], [0.4, 0.8])
    await expect.poll(() => saveState(otherTab), { timeout: 10_000 }).toBe('saved')
    await other.close()

    await context.setOffline(false)
    await page.locator('[data-test=conflict-dialog]').waitFor({ timeout: 20_000 })
    // theirs is on the server, untouched by the offline edits
    expect((await savedDocument(context, id)).document.areas.map((a) => a.kind)).toEqual(['water'])
    await page.locator('[data-test=keep-mine]').click()
    await page.waitForURL((u) => !u.pathname.endsWith(`/yards/${id}`), { timeout: 10_000 })
    const copyId = Number(new URL(page.url()).pathname.split('/').pop())
    expect((await savedDocument(context, copyId)).document.areas.map((a) => a.kind)).toEqual(['bed'])
    await context.close()
  })
})

describe('a site visit offline', () => {
  it('keeps notes and a photo taken offline and sends them when the network returns', async () => {
    // a visit of the demo advisor on a fresh request, made through the advice routes
    const owner = await newHomeowner('e2e-offline-visit')
    const { visitId } = await visitTo(owner.client)

    const { context } = await newContext(browser, { viewport: { width: 768, height: 1024 } })
    expect((await context.request.post('/api/auth/login', { data: { email: 'advisor@example.org', password: 'wildward-demo' } })).status()).toBe(200)
    const page = await context.newPage()
    await page.goto(`/visits/${visitId}`)
    await page.locator('[data-test=visit-notes]').waitFor()
    await expect.poll(() => page.evaluate(async () => !!navigator.serviceWorker.controller && !!(await caches.match(location.href))), { timeout: 30_000 }).toBe(true)

    await context.setOffline(true)
    await page.reload()
    await page.locator('[data-test=visit-notes]').fill('Swale by the downspout stays wet into June.')
    await page.locator('[data-test=save-notes]').click()
    await expect.poll(() => page.locator('[data-test=notes-state]').textContent(), { timeout: 15_000 }).toContain('kept on this device')
    const png = Buffer.from('iVBORw0KGgoAAAANSUhEUgAAAAEAAAABCAYAAAAfFcSJAAAADUlEQVR42mNkYPhfDwAChwGA60e6kgAAAABJRU5ErkJggg==', 'base64')
    await page.locator('#photo-caption').fill('North bed')
    await page.locator('[data-test=photo-input]').setInputFiles({ name: 'north-bed.png', mimeType: 'image/png', buffer: png })
    await page.locator('[data-test=pending-photo]').waitFor()
    await page.close()

    const again = await context.newPage()
    await again.goto(`/visits/${visitId}`)
    await expect.poll(() => again.locator('[data-test=visit-notes]').inputValue(), { timeout: 15_000 }).toBe('Swale by the downspout stays wet into June.')
    await again.locator('[data-test=pending-photo]').waitFor()
    await context.setOffline(false)
    await expect.poll(async () => {
      const v = await (await context.request.get(`/api/visits/${visitId}`)).json() as { notes: string; photos: Array<{ caption: string }> }
      return { notes: v.notes, photos: v.photos.map((p) => p.caption) }
    }, { timeout: 20_000 }).toEqual({ notes: 'Swale by the downspout stays wet into June.', photos: ['North bed'] })
    await expect.poll(() => again.locator('[data-test=pending-photo]').count(), { timeout: 15_000 }).toBe(0)
    await context.close()
  })
})
