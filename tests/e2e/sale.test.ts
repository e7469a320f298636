// The seed sale in Chromium: from a yard's grow-from-seed page to a paid order through the fake hosted checkout
// (a declined card first), the receipt by e-mail, and the coordinator's pick list and "picked up".
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { launch, newContext, outsideRequests, signIn, hydrated, type Browser } from '../support/browser'
import { newHomeowner, waitForMail } from '../support/http'
import { seedYard } from '../api/seed/fixtures'


let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('seed sale in the browser', () => {
  it('buys the seed for a plan by card and the coordinator hands it over', async () => {
    const owner = await newHomeowner('sale-e2e')
    const yardId = await seedYard(owner.client, 'Sale e2e yard')
    const { context, requests } = await newContext(browser)
    const page = await context.newPage()
    await signIn(page, owner.email, 'a-long-test-password')

    await page.goto(`/yards/${yardId}/seeds`)
    await hydrated(page)
    const seedsOf = async (species: string) => Number((await page.locator(`[data-test=seed-row][data-species="${species}"] td:nth-child(6)`).textContent())!.match(/(\d+) seeds/)![1])
    const milkweedSeeds = await seedsOf('Asclepias tuberosa')
    await page.locator('[data-test=packets-to-cart]').click()
    const result = page.locator('[data-test=from-plan-result]')
    await expect.poll(() => result.isVisible()).toBe(true)
    // the demo milkweed lot holds 50 seeds a packet: packets = ceil(seeds ÷ 50)
    const milkweedPackets = Math.ceil(milkweedSeeds / 50)
    expect(await result.textContent()).toContain(`${milkweedPackets} × Asclepias tuberosa`)

    // one cart line per species the plan grows from seed and the sale has
    const added = await result.locator('p').first().locator('em').count()
    expect(added).toBeGreaterThan(0)
    await page.locator('[data-test=go-to-cart]').click()
    await page.waitForURL(/\/sale/)
    await hydrated(page)
    await expect.poll(() => page.locator('[data-test=cart-line]').count()).toBe(added)
    expect(await page.locator('[data-test=cart-line]').filter({ hasText: 'Asclepias tuberosa' }).locator('input').inputValue()).toBe(String(milkweedPackets))
    await page.screenshot({ path: '/tmp/sale-shop-desktop.png', fullPage: true })
    await page.setViewportSize({ width: 768, height: 1024 })
    await page.screenshot({ path: '/tmp/sale-shop-tablet.png', fullPage: true })
    await page.setViewportSize({ width: 1280, height: 860 })
    await page.locator('[data-test=pay-card]').check()
    await page.locator('[data-test=place-order]').click()

    // the fake hosted checkout: a declined card is refused visibly, then the test card pays
    await page.waitForURL(/\/pay\/cs_test_/)
    await page.getByLabel('Card number').fill('4000 0000 0000 0002')
    await page.locator('[data-test=pay]').click()
    await expect.poll(() => page.locator('[data-test=pay-error]').textContent()).toBe('Your card was declined.')
    await page.screenshot({ path: '/tmp/sale-hosted-declined.png' })
    await page.getByLabel('Card number').fill('4242 4242 4242 4242')
    await page.locator('[data-test=pay]').click()
    await page.waitForURL(/\/sale\/orders\/\d+\?paid=1/)
    const orderId = Number(page.url().match(/orders\/(\d+)/)![1])
    await expect.poll(() => page.locator('[data-test=order-status]').textContent(), { timeout: 15_000 }).toBe('Paid')
    const [mail] = await waitForMail(owner.email, 1, 10_000)
    expect(mail?.subject).toBe(`Your seed order ${orderId}: receipt`)
    expect(mail?.text).toContain(`${milkweedPackets} × Asclepias tuberosa`)

    // a donation from the landing page: a custom amount with a dedication, paid on the hosted page
    await page.goto('/')
    await hydrated(page)
    await page.locator('[data-test=donate-link]').click()
    await page.waitForURL(/\/donate/)
    await hydrated(page)
    await page.locator('label', { hasText: 'Other' }).click()
    await page.locator('[data-test=amount-input]').fill('12.34')
    await page.locator('[data-test=dedication]').fill('for the Millrace meadow')
    await page.locator('[data-test=donate]').click()
    await page.waitForURL(/\/pay\/cs_test_/)
    await page.getByLabel('Card number').fill('4242 4242 4242 4242')
    await page.locator('[data-test=pay]').click()
    await page.waitForURL(/\/donate\?thanks=/)
    await expect.poll(() => page.locator('[data-test=donation-thanks]').textContent(), { timeout: 15_000 }).toContain('Thank you for your gift of $12.34')

    await page.goto('/sale/orders')
    expect(await page.locator('[data-test=my-order]').first().textContent()).toContain('Paid')
    expect(outsideRequests(requests)).toEqual([])
    await context.close()

    // the coordinator: the order in the table, on the pick list, then picked up
    const coord = await newContext(browser)
    const cpage = await coord.context.newPage()
    await signIn(cpage, 'coordinator@example.org')
    await cpage.goto('/admin/sale')
    await expect.poll(() => cpage.locator(`[data-test=admin-order][data-order="${orderId}"]`).textContent()).toContain('Paid')
    const gift = cpage.locator('[data-test=donation-row]').filter({ hasText: owner.email })
    await expect.poll(() => gift.textContent()).toContain('$12.34')
    expect(await gift.textContent()).toContain('Received')
    await cpage.screenshot({ path: '/tmp/sale-admin-desktop.png', fullPage: true })
    await cpage.setViewportSize({ width: 1024, height: 768 })
    await cpage.screenshot({ path: '/tmp/sale-admin-tablet.png', fullPage: true })
    await cpage.setViewportSize({ width: 1280, height: 860 })
    await cpage.locator('[data-test=pick-list-link]').first().click()
    await cpage.waitForURL(/\/admin\/sale\/pick-list\/\d+/)
    await expect.poll(() => cpage.locator('[data-test=pick-order]').filter({ hasText: `Order ${orderId}:` }).count()).toBe(1)
    await cpage.emulateMedia({ media: 'print' })
    await cpage.screenshot({ path: '/tmp/sale-pick-list-print.png', fullPage: true })
    await cpage.emulateMedia({ media: 'screen' })
    await cpage.goto(`/sale/orders/${orderId}`)
    await hydrated(cpage)
    await cpage.locator('[data-test=mark-packed]').click()
    await expect.poll(() => cpage.locator('[data-test=order-status]').textContent()).toBe('Packed')
    await cpage.locator('[data-test=mark-picked-up]').click()
    await expect.poll(() => cpage.locator('[data-test=order-status]').textContent()).toBe('Picked up')
    expect(outsideRequests(coord.requests)).toEqual([])
    await coord.context.close()
  })
})
