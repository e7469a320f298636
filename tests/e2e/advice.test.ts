// Advice in the browser: the advisor previews a recommendation's effect on the three shares and records it;
// the owner accepts it from the plan's Advice panel as an undoable edit, which the editor saves.
import { describe, it, expect, beforeAll, afterAll } from 'vitest'
import { launch, newContext, outsideRequests, signIn, hydrated, type Browser } from '../support/browser'
import { newHomeowner } from '../support/http'
import { visitTo } from '../api/advice/fixtures'

let browser: Browser
beforeAll(async () => { browser = await launch() })
afterAll(async () => { await browser?.close() })

describe('advice in the browser', () => {
  it('previews, records and accepts a recommendation, undoably', async () => {
    const owner = await newHomeowner('e2e-advice')
    const { visitId, yardId, advisor } = await visitTo(owner.client)
    expect((await advisor.post(`/api/visits/${visitId}/pins`, { x: 3, y: 2, comment: 'A rain garden could catch the downspout here' })).status).toBe(201)

    const { context: advisorCtx, requests } = await newContext(browser)
    const page = await advisorCtx.newPage()
    await signIn(page, 'advisor@example.org')
    await page.goto(`/visits/${visitId}`)
    await hydrated(page)
    await page.locator('#rec-kind').selectOption('add')
    await page.locator('#rec-bed').selectOption('bed')
    await page.getByLabel('Species (scientific name)').fill('Asclepias tuberosa')
    await page.getByLabel('How many plants').fill('6')
    await page.locator('[data-test=show-effect]').click()
    await expect.poll(() => page.locator('[data-test=preview]').textContent()).toMatch(/By cover area.*→/s)
    await page.locator('[data-test=record-recommendation]').click()
    await expect.poll(() => page.locator('li', { hasText: 'Add 6 × Asclepias tuberosa' }).count()).toBeGreaterThan(0)
    expect(outsideRequests(requests)).toEqual([])
    await advisorCtx.close()

    const { context } = await newContext(browser)
    const op = await context.newPage()
    await signIn(op, owner.email, 'a-long-test-password')
    await op.goto(`/yards/${yardId}`)
    await hydrated(op)
    await op.locator('[data-test=advice-toggle]').click()
    // the visit's pin is drawn on the plan, numbered as the panel lists it
    await expect.poll(() => op.locator('[data-test=pin-list] li').first().textContent()).toContain('rain garden')
    const drawn = () => op.evaluate(() => {
      const stage = (window as unknown as { Konva: { stages: Array<{ find(sel: string): Array<{ x(): number; y(): number }> }> } }).Konva.stages[0]!
      return stage.find('.visit-pin').map((n) => [n.x(), n.y()])
    })
    await expect.poll(drawn).toEqual([[3, 2]])
    const rec = op.locator('[data-test^=recommendation-]').first()
    await expect.poll(() => rec.textContent()).toContain('Add 6 × Asclepias tuberosa')
    await rec.locator('[data-test=accept]').click()
    await expect.poll(() => op.locator('[data-test=undo]').getAttribute('title')).toMatch(/Undo: Accept: Add 6/)
    const recId = Number((await rec.getAttribute('data-test'))!.split('-')[1])
    // the editor saves the accepted change like any other edit
    await expect.poll(async () => (await owner.client.get(`/api/yards/${yardId}`)).body.document.plantings.some((p: { id: string }) => p.id === `rec-${recId}`), { timeout: 15_000 }).toBe(true)
    const statusOf = async () => (await owner.client.get(`/api/yards/${yardId}/advice`)).body.recommendations.find((r: { id: number }) => r.id === recId).status
    expect(await statusOf()).toBe('accepted')
    await op.screenshot({ path: '.data/e2e-advice-panel.png' })
    // Undo takes it out of the plan and back to decide; Redo accepts it again
    await op.locator('[data-test=undo]').click()
    await expect.poll(statusOf).toBe('proposed')
    await expect.poll(() => rec.locator('[data-test=accept]').count()).toBe(1)
    await expect.poll(async () => (await owner.client.get(`/api/yards/${yardId}`)).body.document.plantings.some((p: { id: string }) => p.id === `rec-${recId}`), { timeout: 15_000 }).toBe(false)
    await op.locator('[data-test=redo]').click()
    await expect.poll(statusOf).toBe('accepted')
    await expect.poll(async () => (await owner.client.get(`/api/yards/${yardId}`)).body.document.plantings.some((p: { id: string }) => p.id === `rec-${recId}`), { timeout: 15_000 }).toBe(true)
    await context.close()
  })

  it('keeps what was typed when an invitation fails', async () => {
    const owner = await newHomeowner('e2e-share')
    const { id } = (await owner.client.post('/api/yards', { name: 'Shared in the browser', region: 'US-OH' })).body
    const { context } = await newContext(browser)
    const page = await context.newPage()
    await signIn(page, owner.email, 'a-long-test-password')
    await page.goto(`/yards/${id}/share`)
    await hydrated(page)
    await page.getByLabel('E-mail address').fill(owner.email)
    await page.getByRole('button', { name: 'Send invitation' }).click()
    await expect.poll(() => page.locator('.field-error').first().textContent()).toMatch(/your own address/)
    expect(await page.getByLabel('E-mail address').inputValue()).toBe(owner.email)
    await page.getByLabel('E-mail address').fill(`friend-${Date.now()}@example.test`)
    await page.getByRole('button', { name: 'Send invitation' }).click()
    await expect.poll(() => page.locator('[data-test=share-list]').textContent()).toMatch(/pending/)
    await context.close()
  })
})
