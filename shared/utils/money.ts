// Money as integer minor units (cents) with a currency code: sums stay exact; only display divides.

export interface Money { amountMinor: number; currency: string }

/** Digits after the decimal point for a currency (USD, CAD, EUR 2; JPY 0), from the platform's ISO 4217 data. */
export function minorDigits(currency: string): number {
  return new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase() }).resolvedOptions().maximumFractionDigits ?? 2
}

/** "$12.50" from 1250 and "usd"; built from the integer so no rounding can creep in. */
export function formatMoney(amountMinor: number, currency: string): string {
  const digits = minorDigits(currency)
  const scale = 10 ** digits
  const sign = amountMinor < 0 ? '-' : ''
  const abs = Math.abs(amountMinor)
  const whole = Math.trunc(abs / scale)
  const frac = digits ? '.' + String(abs % scale).padStart(digits, '0') : ''
  const symbol = new Intl.NumberFormat('en-US', { style: 'currency', currency: currency.toUpperCase(), currencyDisplay: 'narrowSymbol' })
    .formatToParts(0).find((p) => p.type === 'currency')?.value ?? currency.toUpperCase()
  return `${sign}${symbol}${whole.toLocaleString('en-US')}${frac}`
}

/** Minor units from a typed decimal amount ("12.5" → 1250); null when it is not a plain amount in that currency. */
export function parseMoney(text: string, currency: string): number | null {
  const digits = minorDigits(currency)
  const m = /^\s*(\d{1,9})(?:\.(\d+))?\s*$/.exec(text.replace(/[$,]/g, ''))
  if (!m) return null
  const frac = m[2] ?? ''
  if (frac.length > digits) return null
  return Number(m[1]) * 10 ** digits + Number(frac.padEnd(digits, '0') || 0)
}

export interface OrderLine { quantity: number; unitPriceMinor: number }

/** Subtotal, delivery fee and total of an order, all in minor units. */
export function orderTotals(lines: OrderLine[], deliveryFeeMinor: number) {
  let subtotalMinor = 0
  for (const l of lines) {
    if (!Number.isSafeInteger(l.quantity) || !Number.isSafeInteger(l.unitPriceMinor)) throw new Error('Money must be whole minor units')
    subtotalMinor += l.quantity * l.unitPriceMinor
  }
  return { subtotalMinor, deliveryFeeMinor, totalMinor: subtotalMinor + deliveryFeeMinor }
}

/** Sums amounts per currency (never adds dollars to euros). */
export function sumByCurrency(items: Money[]): Record<string, number> {
  const out: Record<string, number> = {}
  for (const m of items) out[m.currency] = (out[m.currency] ?? 0) + m.amountMinor
  return out
}
