import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { launch, newContext, outsideRequests, type Browser } from '../support/browser'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('accounts in the browser', () => {
  it('registers, creates a yard, signs out and signs in again, with no request leaving 127.0.0.1', async () => {
    const { context, requests } = await newContext(browser)
    const page = await context.newPage()
    const email = `e2e-${Date.now()}@example.test`

    await page.goto('/')
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toMatch(/native|lawn/i)
    await page.getByRole('link', { name: 'Create an account' }).first().click()
    await page.waitForURL(/\/register/)
    // a failing submit keeps what was typed and names the field
    await page.getByLabel('Your name').fill('Pat Example')
    await page.getByLabel('E-mail').fill(email)
    await page.getByLabel('Password').fill('short')
    await page.getByRole('button', { name: 'Create account' }).click()
    await expect.poll(() => page.locator('.field-error').first().textContent()).toMatch(/10 characters/)
    expect(await page.getByLabel('Your name').inputValue()).toBe('Pat Example')
    await page.getByLabel('Password').fill('a-long-e2e-password')
    await page.getByRole('button', { name: 'Create account' }).click()
    await page.waitForURL(/\/yards$/)

    await page.getByLabel('New yard').fill('Corner lot')
    await page.getByRole('button', { name: 'Create yard' }).click()
    await page.waitForURL(/\/yards\/\d+/)
    await expect.poll(() => page.locator('[data-test=yard-title]').textContent()).toBe('Corner lot')

    await page.getByRole('button', { name: 'Sign out' }).click()
    await page.waitForURL(/\/login/)
    await page.goto('/yards')
    await page.waitForURL(/\/login\?next=/)

    await page.getByLabel('E-mail').fill(email)
    await page.getByLabel('Password').fill('a-long-e2e-password')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(/\/yards$/)
    await expect.poll(() => page.locator('[data-test=yard-list]').textContent()).toContain('Corner lot')

    expect(outsideRequests(requests)).toEqual([])
    // the font is the app's own
    expect(requests.some((u) => /nunito.*\.woff2/i.test(u))).toBe(true)
    await context.close()
  })

  it('keeps coordinator pages from other roles', async () => {
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await page.goto('/login')
    await page.getByLabel('E-mail').fill('homeowner@example.org')
    await page.getByLabel('Password').fill('wildward-demo')
    await page.getByRole('button', { name: 'Sign in' }).click()
    await page.waitForURL(/\/yards/)
    const r = await page.goto('/admin/users')
    expect(r?.status()).toBe(403)
    await context.close()
  })
})
