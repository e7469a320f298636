// Money in integer minor units: sums and formatting, expected values worked by hand.
import { describe, it, expect } from 'vitest'
import { orderTotals, sumByCurrency, formatMoney, parseMoney } from '#shared/utils/money'

describe('money', () => {
  it('order totals: 3 × $4.25 + 2 × $3.50 + $5.00 mail', () => {
    // 1275 + 700 = 1975 cents; + 500 = 2475 cents (by hand)
    expect(orderTotals([{ quantity: 3, unitPriceMinor: 425 }, { quantity: 2, unitPriceMinor: 350 }], 500)).toEqual({ subtotalMinor: 1975, deliveryFeeMinor: 500, totalMinor: 2475 })
  })
  it('ten packets at 10 cents make exactly one dollar (no floating point drift)', () => {
    expect(orderTotals(Array.from({ length: 10 }, () => ({ quantity: 1, unitPriceMinor: 10 })), 0).totalMinor).toBe(100)
  })
  it('refuses fractions of a cent', () => {
    expect(() => orderTotals([{ quantity: 1, unitPriceMinor: 10.5 }], 0)).toThrow()
  })
  it('sums per currency without mixing them', () => {
    expect(sumByCurrency([{ amountMinor: 2500, currency: 'usd' }, { amountMinor: 1000, currency: 'cad' }, { amountMinor: 75, currency: 'usd' }])).toEqual({ usd: 2575, cad: 1000 })
  })
  it('formats and parses', () => {
    expect(formatMoney(2475, 'usd')).toBe('$24.75')
    expect(formatMoney(123456, 'usd')).toBe('$1,234.56')
    expect(formatMoney(5, 'usd')).toBe('$0.05')
    // the yen has no minor unit (ISO 4217)
    expect(formatMoney(500, 'jpy')).toBe('¥500')
    expect(parseMoney('3.5', 'usd')).toBe(350)
    expect(parseMoney('12', 'usd')).toBe(1200)
    expect(parseMoney('1.234', 'usd')).toBeNull()
    expect(parseMoney('-1', 'usd')).toBeNull()
  })
})
