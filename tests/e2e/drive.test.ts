// The coordinator's dashboard in the browser: totals, three charts, the table and a bulk mail's progress bar.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { launch, newContext, outsideRequests, signIn, type Browser, type Page } from '../support/browser'
import { demo, newHomeowner } from '../support/http'

let browser: Browser
// Vue marks the app's root once it has hydrated; before that a change to a form control is lost
const hydrated = (page: Page) => page.waitForFunction(() => !!(document.querySelector('#__nuxt') as { __vue_app__?: unknown } | null)?.__vue_app__)
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('pledge drive dashboard in the browser', () => {
  it('pledges from the form, then shows totals, charts, the table and a mail going out', async () => {
    const owner = await newHomeowner('e2e-pledge')
    const { id } = (await owner.client.post('/api/yards', { name: 'Pledged in the browser', region: 'US-OH' })).body
    const { context: homeCtx } = await newContext(browser)
    const home = await homeCtx.newPage()
    await signIn(home, owner.email, 'a-long-test-password')
    await home.goto(`/yards/${id}/pledge`)
    await hydrated(home)
    await home.getByRole('button', { name: 'Pledge the yard' }).click()
    await expect.poll(() => home.locator('.field-error').first().textContent()).toMatch(/neighbourhood/)
    await home.getByLabel('Neighbourhood or postal code').fill('Browserby')
    await home.getByRole('button', { name: 'Pledge the yard' }).click()
    await expect.poll(() => home.locator('[data-test=pledge-status]').first().textContent()).toMatch(/pledged/)
    await homeCtx.close()

    const summary = (await (await demo('coordinator')).get('/api/drives/current/summary')).body
    const { context, requests } = await newContext(browser, { viewport: { width: 1280, height: 1800 } })
    const page = await context.newPage()
    await signIn(page, 'coordinator@example.org')
    await page.goto('/drive')
    await hydrated(page)
    await expect.poll(() => page.locator('[data-test=total-pledged]').textContent()).toContain(`/ ${summary.target}`)
    await expect.poll(() => page.locator('canvas').count()).toBe(3)
    await expect.poll(() => page.locator('[data-test=pledge-table] tbody tr').count()).toBeGreaterThan(0)
    // sorting by share puts the table in order
    await page.getByRole('button', { name: 'Native share' }).click()
    await expect.poll(() => page.locator('th[aria-sort=descending]').textContent()).toContain('Native share')

    await page.getByLabel('Kind').selectOption('thanks')
    await page.getByRole('button', { name: 'Send' }).click()
    await expect.poll(() => page.locator('[data-test=mail-progress]').textContent(), { timeout: 30_000 }).toMatch(/(\d+) of \1 sent/)
    await page.screenshot({ path: '.data/e2e-drive-dashboard.png', fullPage: true })
    expect(outsideRequests(requests)).toEqual([])
    await context.close()
  })
})
