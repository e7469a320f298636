// The species table (search, filter, sort, paging) and the Find plants page in Chromium, loopback only.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { launch, newContext, outsideRequests, signIn, type Browser } from '../support/browser'

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
    // the page opens on the region's natives; wait for that answer before asking for a spot
    await expect.poll(() => page.getByTestId('fits').locator('li.card').count(), { timeout: 30_000 }).toBeGreaterThan(0)
    await page.getByLabel('State or province').selectOption('US-OH')
    await page.getByLabel('USDA hardiness zone').selectOption('6a')
    await page.getByLabel('Sun').selectOption('part')
    await page.getByLabel('Moisture').selectOption('wet')
    await page.getByLabel('Kind of plant').selectOption('shrub')
    await page.getByRole('button', { name: 'Find plants' }).click()
    const fits = page.getByTestId('fits')
    await expect.poll(() => fits.locator('li.card').first().textContent(), { timeout: 30_000 }).toMatch(/shrub/)
    const first = await fits.locator('li.card').first().textContent()
    expect(first).toMatch(/Takes [^(]*part shade/)
    expect(first).toMatch(/Hardy to zone \d+[ab] \(your yard: 6a\)/)
    expect(first).toMatch(/fit \d+ of 100/)
    expect(first).toMatch(/\((USDA PLANTS|estimated)\)/)
    // natives whose site needs are not recorded come below, saying so
    const more = page.getByTestId('fits-unrecorded')
    await expect.poll(() => more.locator('li.card').count()).toBeGreaterThan(0)
    expect(await more.locator('li.card').first().textContent()).toMatch(/Site needs not recorded — check your regional list/)
    // USDA zones only: no invitation to another country's zone map
    expect(await page.getByText(/USDA zones only/).count()).toBe(1)
    expect(await page.getByText(/Canadian/).count()).toBe(0)
    expect(outsideRequests(requests)).toEqual([])
    await context.close()
  })

  it('opens the species table and find plants on Ohio natives', async () => {
    const { context } = await newContext(browser)
    // the region choice defaults to Ohio (useRegionChoice)
    const page = await context.newPage()
    await page.goto('/species')
    const table = page.getByTestId('species-table')
    await expect.poll(() => table.locator('tbody tr').count()).toBeGreaterThan(10)
    const statuses = await table.locator('tbody tr td:last-child').allTextContents()
    expect(statuses.every((t) => t.trim() === 'Native')).toBe(true)
    await page.goto('/find-plants')
    const fits = page.getByTestId('fits')
    await expect.poll(() => fits.locator('li.card').count(), { timeout: 30_000 }).toBeGreaterThan(0)
    expect(await page.getByText(/not recorded in Ohio/).count()).toBe(0)
    await context.close()
  })
})

describe('species search as you type in an Ohio yard', () => {
  it('gives an Ohio native as the first hit for "purple coneflower" and "milkweed"', async () => {
    const { context, requests } = await newContext(browser)
    const email = `search-${Date.now()}@example.test`
    expect((await context.request.post('/api/auth/register', { data: { email, name: 'Search Test', password: 'a-long-e2e-password' } })).status()).toBe(201)
    const yard = await context.request.post('/api/yards', { data: { name: 'Ohio yard', region: 'US-OH' } })
    const id = (await yard.json()).id
    const page = await context.newPage()
    await page.goto(`/yards/${id}`)
    await page.locator('[data-test=yard-canvas] canvas').first().waitFor()
    await page.locator('[data-tool=plant]').click()
    const search = page.locator('#plant-choice')
    // USDA PLANTS: Echinacea purpurea and the Asclepias milkweeds below are native to the lower 48 and recorded in Ohio
    for (const [term, want] of [['purple coneflower', /Echinacea purpurea/], ['milkweed', /Asclepias /]] as const) {
      await search.fill(term)
      const first = page.locator('[role=option]').first()
      await expect.poll(() => first.textContent(), { timeout: 10_000 }).toMatch(want)
      expect(await first.textContent()).toMatch(/· native\s*$/)
      // the route agrees: the first hit is native in Ohio
      const api = await (await context.request.get(`/api/species?region=US-OH&q=${encodeURIComponent(term)}&pageSize=1`)).json()
      expect(api.items[0].status).toBe('native')
      expect((await first.textContent())!).toContain(api.items[0].scientificName)
    }
    await page.screenshot({ path: '.data/search-ohio.png' })
    expect(outsideRequests(requests)).toEqual([])
    await context.close()
  })
})

describe('a coordinator corrects one species in a form', () => {
  it('shows a bad value beside its field, keeps what was typed, then saves and shows the source on the species page', async () => {
    for (const viewport of [{ width: 1280, height: 800 }, { width: 768, height: 1024 }]) {
      const { context, requests } = await newContext(browser, { viewport })
      const page = await context.newPage()
      await signIn(page, 'coordinator@example.org')
      await page.goto('/species/Zizia%20aurea')
      await page.getByTestId('edit-species').click()
      await page.waitForURL(/\/admin\/species\//)
      const form = page.getByTestId('species-edit')
      await form.waitFor()
      await page.getByLabel('Mature height (m)').fill('0.7')
      await page.getByRole('button', { name: 'Save changes' }).click()
      // no source named: the shared schema refuses it beside the field, and the height stays as typed
      await expect.poll(() => page.locator('#ed-source-error').textContent()).toMatch(/Name the source/)
      expect(await page.getByLabel('Mature height (m)').inputValue()).toBe('0.7')
      await page.screenshot({ path: `.data/species-edit-${viewport.width}.png`, fullPage: true })
      await page.getByLabel('Where these values come from').fill(`regional list check ${viewport.width}`)
      await page.getByRole('button', { name: 'Save changes' }).click()
      await expect.poll(() => page.getByRole('status').textContent()).toMatch(/Saved 1 change|Nothing had changed/)
      await page.goto('/species/Zizia%20aurea')
      await expect.poll(() => page.locator('[data-source=height]').textContent()).toMatch(/your organization's list/)
      expect(outsideRequests(requests)).toEqual([])
      await context.close()
    }
  })
  it('shows find plants with both groups, legibly, on a desktop and a tablet', async () => {
    for (const viewport of [{ width: 1280, height: 800 }, { width: 1024, height: 768 }, { width: 768, height: 1024 }]) {
      const { context } = await newContext(browser, { viewport })
      const page = await context.newPage()
      await page.goto('/find-plants')
      await expect.poll(() => page.getByTestId('fits').locator('li.card').count(), { timeout: 30_000 }).toBeGreaterThan(0)
      await page.getByLabel('USDA hardiness zone').selectOption('6a')
      await page.getByLabel('Sun').selectOption('full')
      await page.getByRole('button', { name: 'Find plants' }).click()
      await expect.poll(() => page.getByTestId('fits-unrecorded').locator('li.card').count(), { timeout: 30_000 }).toBeGreaterThan(0)
      await page.screenshot({ path: `.data/find-plants-${viewport.width}.png` })
      await context.close()
    }
  })
})
