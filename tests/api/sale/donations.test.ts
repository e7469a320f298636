// Donations through the fake hosted checkout: receipt with the thank-you template, own list, coordinator totals.
import { describe, it, expect } from 'vitest'
import { demo, newHomeowner, waitForMail } from '../../support/http'
import { payOnHostedPage, until } from '../../support/sale'

describe('donations', () => {
  it('a paid donation is mailed a receipt, listed for the giver and counted in the coordinator totals', async () => {
    const giver = await newHomeowner('giver')
    const coord = await demo('coordinator')
    const before = (await coord.get('/api/admin/sale/donations')).body.totals
    const r = await giver.client.post('/api/donations', { amountMinor: 2500, dedication: 'in memory of the old oak' })
    expect(r.status).toBe(201)
    expect((await payOnHostedPage(r.body.url)).status).toBe(303)
    const mine = await until(() => giver.client.get('/api/donations').then((x) => x.body.donations), (d) => d[0]?.status === 'paid')
    expect(mine).toHaveLength(1)
    expect(mine[0].amountMinor).toBe(2500)
    const [mail] = await waitForMail(giver.email)
    expect(mail?.text).toContain('$25.00')
    expect(mail?.text).toContain('in memory of the old oak')
    const after = (await coord.get('/api/admin/sale/donations')).body.totals
    expect(after.count).toBeGreaterThanOrEqual(before.count + 1)
    expect(after.byCurrency.usd - (before.byCurrency.usd ?? 0)).toBeGreaterThanOrEqual(2500)
    // another homeowner sees none of it
    const other = await newHomeowner('other')
    expect((await other.client.get('/api/donations')).body.donations).toEqual([])
    const csv = await coord.get('/api/admin/sale/donations/export')
    expect(csv.body).toContain('in memory of the old oak')
  })

  it('refuses amounts under $1 and fractions of a cent, naming the field', async () => {
    const giver = await newHomeowner('giver')
    for (const amountMinor of [50, 10.5, -100]) {
      const r = await giver.client.post('/api/donations', { amountMinor })
      expect(r.status).toBe(400)
      expect(r.body.data.fields.amountMinor).toBeTruthy()
    }
  })
})
