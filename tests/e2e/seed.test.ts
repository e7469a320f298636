import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { launch, newContext, outsideRequests, signIn, type Browser } from '../support/browser'
import { demo, newHomeowner } from '../support/http'
import { seedYard } from '../api/seed/fixtures'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('grow from seed in the browser', () => {
  it('shows the plan, saves edits, prints pot tags, offers the calendar and reminders', async () => {
    const owner = await newHomeowner('seed-e2e')
    const yardId = await seedYard(owner.client, 'Seed page yard')
    const { context, requests } = await newContext(browser)
    const page = await context.newPage()
    await signIn(page, owner.email, 'a-long-test-password')

    // reached from the yard editor's bar
    await page.goto(`/yards/${yardId}`)
    await page.locator('[data-test=grow-from-seed]').click()
    await page.waitForURL(new RegExp(`/yards/${yardId}/seeds$`))
    const rows = page.locator('[data-test=seed-row]')
    await expect.poll(() => rows.count()).toBe(3)
    const cone = page.locator('[data-test=seed-row][data-species="Echinacea purpurea"]')
    // 25 plants × 1.2 ÷ 10 a pot → 3 pots (the seed-plan rule)
    expect(await cone.locator('[data-test=pots]').textContent()).toBe('3')

    // edits: 15 seedlings a pot and milkweed off; saved, and still there after a reload
    await cone.locator('[data-test=seedlings]').fill('15')
    await page.locator('[data-test=seed-row][data-species="Asclepias tuberosa"] [data-test=grow]').uncheck()
    await page.locator('[data-test=save-plan]').click()
    await expect.poll(() => page.locator('[data-test=plan-saved]').isVisible()).toBe(true)
    // 25 × 1.2 ÷ 15 = 2 pots
    expect(await cone.locator('[data-test=pots]').textContent()).toBe('2')
    await page.reload()
    await expect.poll(() => page.locator('[data-test=seed-row][data-species="Echinacea purpurea"] [data-test=pots]').textContent()).toBe('2')
    expect(await page.locator('[data-test=seed-row][data-species="Asclepias tuberosa"] [data-test=grow]').isChecked()).toBe(false)

    // a bad value keeps what was typed and names the problem
    await page.locator('[data-test=seed-row][data-species="Echinacea purpurea"] [data-test=seedlings]').fill('0')
    await page.locator('[data-test=save-plan]').click()
    await expect.poll(() => page.locator('[data-test=plan-error]').textContent()).toMatch(/highlighted/)
    expect(await page.locator('[data-test=seed-row][data-species="Echinacea purpurea"] [data-test=seedlings]').inputValue()).toBe('0')
    await page.locator('[data-test=seed-row][data-species="Echinacea purpurea"] [data-test=seedlings]').fill('15')

    // timeline, one tag per pot
    expect(await page.locator('[data-test=timeline-task][data-kind=plant-out]').count()).toBeGreaterThan(0)
    const totalPots = Number(await page.locator('[data-test=total-pots]').textContent())
    expect(await page.locator('[data-test=pot-tag]').count()).toBe(totalPots)
    expect(await page.locator('[data-test=pot-tags]').textContent()).toMatch(/in pencil/)

    // print: only the tags, each 9 cm wide (at 96 px to the inch: 9 ÷ 2.54 × 96 ≈ 340 px, CSS 2.1 absolute units)
    await page.evaluate(() => document.body.classList.add('printing-tags'))
    await page.emulateMedia({ media: 'print' })
    const box = await page.locator('[data-test=pot-tag]').first().boundingBox()
    expect(Math.round(box!.width)).toBe(340)
    expect(await page.locator('[data-test=seed-table]').evaluate((el) => getComputedStyle(el).visibility)).toBe('hidden')
    await page.screenshot({ path: '/tmp/seed-tags-print.png' })
    await page.emulateMedia({ media: 'screen' })
    await page.evaluate(() => document.body.classList.remove('printing-tags'))

    // calendar download and a private address
    expect(await page.locator('[data-test=ics-download]').getAttribute('href')).toBe(`/api/yards/${yardId}/seed-plan.ics`)
    await page.locator('[data-test=feed-new]').click()
    await expect.poll(() => page.locator('[data-test=feed-url]').inputValue()).toMatch(/\/calendar\/[A-Za-z0-9_-]{43}\/seeds\.ics$/)
    await page.locator('[data-test=feed-revoke]').click()
    await expect.poll(() => page.locator('[data-test=feed-url]').count()).toBe(0)

    // reminders on
    await page.locator('[data-test=reminders-toggle]').check()
    await expect.poll(() => page.locator('[data-test=reminders-scheduled]').textContent()).toMatch(/\d+ reminders waiting/)
    await page.screenshot({ path: '/tmp/seed-page.png', fullPage: true })

    expect(outsideRequests(requests)).toEqual([])
    await context.close()
  })

  it('plans the demo yard as a gardener would: asters sown outdoors in fall for winter cold, the oak fresh and deep, no lawn grass', async () => {
    const home = await demo('homeowner')
    const yards = (await home.get('/api/yards')).body.items as Array<{ id: number; name: string }>
    const yard = yards.find((y) => y.name === 'Larch Lane front and back')!
    const { context, requests } = await newContext(browser, { viewport: { width: 1024, height: 768 } })
    const page = await context.newPage()
    await signIn(page, 'homeowner@example.org')
    // planned on 1 December 2026, so the season is 2027 (frost dates 04-28 and 10-14)
    await page.goto(`/yards/${yard.id}/seeds`)
    const rows = page.locator('[data-test=seed-row]')
    await expect.poll(() => rows.count()).toBeGreaterThan(0)

    // New England aster drift: USDA PLANTS records no cold need and no seed size → sown outdoors in late fall to early
    // winter (winter gives the cold period), under a thin cover of coarse sand (common practice)
    const aster = page.locator('[data-test=seed-row][data-species="Symphyotrichum novae-angliae"]')
    expect(await aster.locator('[data-test=sow-when]').getAttribute('data-route')).toBe('outdoor-winter')
    expect(await aster.locator('[data-test=sow-when]').textContent()).toMatch(/late fall to early winter/)
    expect(await aster.locator('[data-test=treatment]').textContent()).toMatch(/winter cold given.*(surface-sown|coarse sand)/)
    expect(await aster.locator('[data-test=grow]').isChecked()).toBe(true)
    await aster.locator('summary').click()
    expect(await aster.locator('details').textContent()).toMatch(/not recorded/)

    // white oak: acorns sown fresh in fall, 2–3 cm deep under hardware cloth (Agriculture Handbook 727, Quercus)
    const oak = page.locator('[data-test=seed-row][data-species="Quercus alba"]')
    expect(await oak.locator('[data-test=sow-when]').getAttribute('data-route')).toBe('fresh')
    expect(await oak.locator('[data-test=treatment]').textContent()).toMatch(/sown fresh.*2–3 cm deep, under hardware cloth/)

    // the lawn's Kentucky bluegrass (USDA: native and introduced in Ohio) and the invasive barberry are not offered
    expect(await page.locator('[data-test=seed-row][data-species="Poa pratensis"]').count()).toBe(0)
    expect(await page.locator('[data-test=seed-row][data-species="Berberis thunbergii"]').count()).toBe(0)
    expect(await page.locator('[data-test=timeline-task][data-kind=sow-fresh]').count()).toBeGreaterThan(0)
    await page.screenshot({ path: '/tmp/seed-demo-tablet.png', fullPage: true })
    await page.setViewportSize({ width: 1280, height: 800 })
    await page.screenshot({ path: '/tmp/seed-demo-desktop.png', fullPage: true })
    expect(outsideRequests(requests)).toEqual([])
    await context.close()
  })
})
