// The yard now and with the plan in Chromium: a yard with something in each phase, drawn and switched by a
// person, the moves added to the plan (and undone), work marked planted, the share now rising and the history
// chart gaining a point; screenshots on a desktop and a tablet.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { mkdirSync } from 'node:fs'
import { launch, newContext, outsideRequests, type Browser, type Page } from '../support/browser'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

const SHOTS = '.data/shots'
const rect = (x: number, y: number, w: number, h: number) => [[x, y], [x + w, y], [x + w, y + h], [x, y + h]]
const share = async (page: Page, test: string) => Number(await page.locator(`[data-test=${test}]`).getAttribute('data-share'))

describe('phases in the editor', () => {
  it('draws all three phases, adds a move to the plan, marks it planted, and the share now and the history follow', async () => {
    mkdirSync(SHOTS, { recursive: true })
    const { context, requests } = await newContext(browser)
    const email = `phases-${Date.now()}@example.test`
    expect((await context.request.post('/api/auth/register', { data: { email, name: 'Phase Test', password: 'a-long-e2e-password' } })).status()).toBe(201)
    const document = {
      format: 'wildward.yard/2', units: 'm', region: 'US-OH', boundary: rect(0, 0, 12, 12), areas: [], lines: [],
      plantings: [
        { id: 'lawn', species: 'Poa pratensis', points: rect(0, 0, 12, 12), z: 0, spacing: null, height: 0.08, label: 'Lawn' },
        { id: 'barberry', species: 'Berberis thunbergii', x: 9, y: 9, count: 4, spread: 1.2, height: 1.2, label: 'Barberry' },
        { id: 'milkweed', species: 'Asclepias tuberosa', x: 2, y: 9, count: 3, spread: 0.45, height: 0.6 },
      ],
    }
    const yardId = (await (await context.request.post('/api/yards', { data: { name: 'Phase yard', region: 'US-OH', document } })).json()).id
    const page = await context.newPage()
    await page.setViewportSize({ width: 1280, height: 800 })
    await page.goto(`/yards/${yardId}`)
    await page.locator('[data-test=yard-canvas] canvas').first().waitFor()
    await page.locator('[data-test=share-now-area]').waitFor()

    // a plant to plant: placed with the plant tool, then one key (T) makes it "to plant"
    await page.locator('[data-tool=plant]').click()
    await page.locator('#plant-choice').fill('Echinacea purpurea')
    await page.locator('[role=option]', { hasText: 'Echinacea purpurea' }).first().click()
    const box = (await page.locator('[data-test=yard-canvas]').boundingBox())!
    await page.mouse.click(box.x + box.width * 0.35, box.y + box.height * 0.35)
    await page.locator('[data-tool=select]').click()
    await page.keyboard.press('t')
    await expect.poll(() => page.locator('[data-test=element-list] [data-element]', { hasText: 'To plant' }).count()).toBe(1)
    // the barberry: to remove, by one click
    await page.locator('[data-element=barberry]').click()
    await page.locator('[data-set-phase=removing]').click()
    await expect.poll(() => page.locator('[data-element=barberry]').textContent()).toMatch(/To remove/)
    await page.locator('[data-test=phase-filter]').selectOption('planned')
    expect(await page.locator('[data-test=element-list] [data-element]').count()).toBe(1)
    await page.locator('[data-test=phase-filter]').selectOption('')

    // now → with the plan: removing the barberry and planting a coneflower raise the count share of the plan only
    await expect.poll(async () => (await share(page, 'share-count')) > (await share(page, 'share-now-count'))).toBe(true)
    for (const v of ['now', 'planned', 'both'] as const) {
      await page.locator(`[data-phase-view=${v}]`).click()
      await page.screenshot({ path: `${SHOTS}/phases-${v}-desktop.png` })
    }

    // the time control: a young plan covers less than a mature one
    const mature = await share(page, 'share-area')
    await page.locator('[data-years="0"]').click()
    await expect.poll(() => share(page, 'share-area')).toBeLessThanOrEqual(mature)
    await page.locator('[data-years=mature]').click()

    // the cover moves added to the plan in one click, and undone
    await page.locator('[data-tab=score]').click()
    const before = await page.locator('[data-test=element-list] [data-element]').count()
    await page.locator('[data-apply-moves=area]').click()
    await expect.poll(() => page.locator('[data-test=element-list] [data-element]').count()).toBeGreaterThan(before)
    await page.locator('[data-test=undo]').click()
    await expect.poll(() => page.locator('[data-test=element-list] [data-element]').count()).toBe(before)
    await page.locator('[data-test=redo]').click()
    await expect.poll(() => page.locator('[data-test=element-list] [data-element]').count()).toBeGreaterThan(before)
    await expect.poll(() => share(page, 'share-area'), { timeout: 10_000 }).toBeGreaterThanOrEqual(0.7 - 1e-9)
    expect(await page.locator('[data-test=history]').getAttribute('data-points')).toBe('0')

    // mark the new drift planted today: the share now rises and the history chart gains a point
    const nowBefore = await share(page, 'share-now-area')
    await page.locator('[data-test=element-list] [data-element^=lawn-drift]').first().click()
    await page.locator('[data-tab=details]').click()
    await page.locator('[data-test=mark-planted]').click()
    await expect.poll(() => share(page, 'share-now-area'), { timeout: 15_000 }).toBeGreaterThan(nowBefore)
    await page.locator('[data-tab=score]').click()
    await expect.poll(() => page.locator('[data-test=history]').getAttribute('data-points'), { timeout: 10_000 }).toBe('1')
    await page.screenshot({ path: `${SHOTS}/phases-history-desktop.png` })
    const history = await (await context.request.get(`/api/yards/${yardId}/history`)).json()
    expect(history.points[0].now.area).toBeCloseTo(await share(page, 'share-now-area'), 6)

    // a date in the future is refused in the form
    await page.locator('[data-test=element-list] [data-element]', { hasText: 'Echinacea' }).first().click()
    await page.locator('[data-tab=details]').click()
    await page.locator('[data-test=work-date]').fill('2999-01-01')
    await page.locator('[data-test=mark-planted]').click()
    await expect.poll(() => page.locator('[data-test=work-error]').textContent()).toMatch(/today or earlier/)

    for (const [w, h] of [[1024, 768], [768, 1024]] as const) {
      await page.setViewportSize({ width: w, height: h })
      await page.waitForTimeout(300)
      await page.screenshot({ path: `${SHOTS}/phases-tablet-${w}x${h}.png` })
    }
    await page.goto('/yards')
    await page.locator('[data-test=yard-shares]').first().waitFor()
    expect(await page.locator('[data-test=yard-shares]').first().textContent()).toMatch(/now → .* with the plan/)
    expect(outsideRequests(requests)).toEqual([])
    await context.close()
  })
})
