// The species table (search, filter, sort, paging) and the Find plants page in Chromium, loopback only.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { launch, newContext, outsideRequests, type Browser } from '../support/browser'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('species pages in the browser', () => {
  it('searches, filters, sorts and pages the species table, and opens a species page', async () => {
    const { context, requests } = await newContext(browser)
    const page = await context.newPage()
    await page.goto('/species')
    const table = page.getByTestId('species-table')
    await expect.poll(() => table.locator('tbody tr').count()).toBeGreaterThan(10)
    const paging = page.getByTestId('species-paging')
    const firstPaging = await paging.textContent()
    await page.getByRole('button', { name: 'Next' }).click()
    await expect.poll(() => paging.textContent()).toMatch(/Page 2 of/)

    await page.getByLabel('Search species').fill('butterfly milkweed')
    await expect.poll(() => table.locator('tbody tr').first().textContent()).toMatch(/Asclepias tuberosa/)
    await expect.poll(() => paging.textContent()).toMatch(/Page 1 of/)
    expect(await table.locator('tbody tr').first().textContent()).toMatch(/Native/)

    await page.getByLabel('Search species').fill('')
    await page.getByLabel('Layer').selectOption('tree')
    await page.getByRole('button', { name: /^Height/ }).click()
    await expect.poll(async () => (await table.locator('th[aria-sort="descending"]').textContent()) ?? '').toMatch(/Height/)
    await expect.poll(() => table.locator('tbody tr').first().locator('td').nth(2).textContent()).toBe('tree')
    const heights = (await table.locator('tbody tr td:nth-child(8)').allTextContents()).map((t) => parseFloat(t))
    expect(heights).toEqual([...heights].sort((a, b) => b - a))
    expect(await paging.textContent()).not.toBe(firstPaging)

    await page.getByLabel('Layer').selectOption('')
    await page.getByLabel('Search species').fill('Asclepias tuberosa')
    await table.getByRole('link', { name: 'Asclepias tuberosa' }).click()
    await page.waitForURL(/\/species\/Asclepias/)
    await expect.poll(() => page.getByRole('heading', { level: 1 }).textContent()).toBe('Asclepias tuberosa')
    expect(await page.getByText('USDA gives native status for the lower 48 states').count()).toBeGreaterThan(0)
    expect(await page.getByText('estimated', { exact: true }).count()).toBeGreaterThan(0)
    await expect.poll(() => page.getByTestId('native-regions').textContent()).toMatch(/Ohio/)
    expect(outsideRequests(requests)).toEqual([])
    await context.close()
  })

  it('finds native plants for a spot, with reasons', async () => {
    const { context, requests } = await newContext(browser, { viewport: { width: 820, height: 1180 } })
    const page = await context.newPage()
    await page.goto('/find-plants')
    await page.getByLabel('State or province').selectOption('US-OH')
    await page.getByLabel('Hardiness zone').selectOption('6a')
    await page.getByLabel('Sun').selectOption('part')
    await page.getByLabel('Moisture').selectOption('wet')
    await page.getByLabel('Kind of plant').selectOption('shrub')
    await page.getByRole('button', { name: 'Find plants' }).click()
    const fits = page.getByTestId('fits')
    await expect.poll(() => fits.locator('li.card').count()).toBeGreaterThan(0)
    const first = await fits.locator('li.card').first().textContent()
    expect(first).toMatch(/shrub/)
    expect(first).toMatch(/Takes part shade/)
    expect(first).toMatch(/Hardy in zone 6a/)
    expect(outsideRequests(requests)).toEqual([])
    await context.close()
  })
})
