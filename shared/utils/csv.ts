// CSV cells that a spreadsheet will not run: text starting with = + - @ or a tab/CR gets a leading apostrophe
// (OWASP "CSV Injection"); numbers are written as numbers.

/** A text cell that a spreadsheet would read as a formula. */
export const CSV_FORMULA_START = /^[=+\-@\t\r]/

/** One CSV cell (RFC 4180 quoting), neutralised against formula injection. */
export function csvCell(v: unknown): string {
  if (typeof v === 'number') return Number.isFinite(v) ? String(v) : ''
  const s = v instanceof Date ? v.toISOString() : String(v ?? '')
  const safe = CSV_FORMULA_START.test(s) ? `'${s}` : s
  return /[",\n\r]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe
}
