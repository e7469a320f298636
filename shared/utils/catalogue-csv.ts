// Reading the coordinator's catalogue CSV: cell parsers and row checks, pure so that preview, apply and the unit
// tests share them. The server decides what is a change (it knows the current values).
import Papa from 'papaparse'
import { LAYERS, REGION_STATUSES } from '../types/species'
import { SUN, SOIL, MOISTURE } from '../schemas/yard-document'
import { CSV_COLUMNS, CSV_READ_ONLY_COLUMNS, IMPORT_MAX_ROWS, SOURCE_PATTERN, type CsvColumn, type ImportError, type OverrideField } from '../schemas/species'
import { REGIONS } from './regions'
import { zoneIndex, roundToCm } from './catalogue-rules'
import { CSV_FORMULA_START } from './csv'

export type Parsed = { value: unknown } | { error: string }

const MONTHS = ['jan', 'feb', 'mar', 'apr', 'may', 'jun', 'jul', 'aug', 'sep', 'oct', 'nov', 'dec']
const list = (raw: string) => raw.split(/[;,/|\s]+/).map((s) => s.trim().toLowerCase()).filter(Boolean)

function enumList<T extends string>(allowed: readonly T[], raw: string, what: string): Parsed {
  const items = list(raw)
  const bad = items.filter((i) => !allowed.includes(i as T))
  if (bad.length) return { error: `${what} must be ${allowed.join(', ')} (separate several with ;), not "${bad[0]}"` }
  return { value: allowed.filter((a) => items.includes(a)) }
}

/** A length in metres: "0.6", "0.6 m", "2 ft", "2'"; within (0, max]. */
export function parseLength(raw: string, max: number): Parsed {
  const m = /^(\d+(?:\.\d+)?)\s*(m|ft|feet|')?$/i.exec(raw.trim())
  if (!m) return { error: 'Write a length such as 0.6 (metres) or 2 ft' }
  const metres = /^(ft|feet|')$/i.test(m[2] ?? '') ? Number(m[1]) * 0.3048 : Number(m[1])
  if (!(metres > 0) || metres > max) return { error: `Must be more than 0 and at most ${max} m` }
  return { value: roundToCm(metres) }
}

function parseBool(raw: string): Parsed {
  const s = raw.trim().toLowerCase()
  if (['yes', 'y', 'true', '1'].includes(s)) return { value: true }
  if (['no', 'n', 'false', '0'].includes(s)) return { value: false }
  return { error: 'Write yes or no' }
}

function parseInteger(raw: string, min: number, max: number): Parsed {
  const s = raw.trim().replace(/[_\s]/g, '')
  const n = /^\d+(\.\d+)?(e\+?\d+)?$/i.test(s) ? Number(s) : NaN
  if (!Number.isFinite(n) || !Number.isInteger(n) || n < min || n > max) return { error: `Write a whole number from ${min} to ${max}` }
  return { value: n }
}

/** One cell of a data column (never called for blank cells: blank means "leave as is"). */
export function parseCell(column: OverrideField, raw: string): Parsed {
  const v = raw.trim()
  switch (column) {
    case 'status':
      return (REGION_STATUSES as readonly string[]).includes(v) ? { value: v } : { error: `Status must be one of ${REGION_STATUSES.join(', ')}` }
    case 'layer':
      return (LAYERS as readonly string[]).includes(v.toLowerCase()) ? { value: v.toLowerCase() } : { error: `Layer must be ${LAYERS.join(', ')}` }
    case 'commonName': return v.length <= 200 ? { value: v } : { error: 'At most 200 characters' }
    case 'height': return parseLength(v, 120)
    case 'spread': return parseLength(v, 60)
    case 'spacing': return parseLength(v, 20)
    case 'sun': return enumList(SUN, v, 'Sun')
    case 'moisture': return enumList(MOISTURE, v, 'Moisture')
    case 'soil': return enumList(SOIL, v, 'Soil')
    case 'bloomMonths': {
      const months = new Set<number>()
      for (const item of list(v)) {
        const n = /^\d+$/.test(item) ? Number(item) : MONTHS.indexOf(item.slice(0, 3)) + 1
        if (!(n >= 1 && n <= 12)) return { error: `Months are 1–12 or names (Apr;May), not "${item}"` }
        months.add(n)
      }
      return { value: [...months].sort((a, b) => a - b) }
    }
    case 'minZone': return zoneIndex(v) !== null ? { value: v } : { error: 'Write a hardiness zone such as 5a' }
    case 'toxicity': {
      const s = v.toLowerCase()
      return ['none', 'slight', 'moderate', 'severe'].includes(s) ? { value: s } : { error: 'Toxicity must be none, slight, moderate or severe' }
    }
    case 'propagatedBySeed': case 'coldStratification': case 'seedNeedsLight': case 'scarify': case 'hotWaterSoak': case 'sowFresh':
      return parseBool(v)
    case 'coldMoistDays': return parseInteger(v, 0, 365)
    case 'seedsPerPound': return parseInteger(v, 1, 1e9)
    case 'seedlingsPerPot': return parseInteger(v, 1, 500)
    case 'commercialAvailability': return v.length <= 80 ? { value: v } : { error: 'At most 80 characters' }
    case 'notes': return v.length <= 1000 ? { value: v } : { error: 'At most 1000 characters' }
  }
}

export interface CsvEntry {
  /** the file's row number, header = 1 */
  row: number
  scientificName: string
  region: string
  source: string
  values: Partial<Record<OverrideField, unknown>>
}

const DATA_COLUMNS = CSV_COLUMNS.filter((c) => c !== 'scientificName' && c !== 'region' && c !== 'source') as OverrideField[]
const KNOWN = new Set<string>([...CSV_COLUMNS, ...CSV_READ_ONLY_COLUMNS])
export { SOURCE_PATTERN }

/**
 * Parses and checks the CSV text: unknown columns, a missing scientificName column, bad cells, status without
 * a region, one name+region given twice. Returns entries and row-level errors (row, column, message).
 */
export function readCatalogueCsv(text: string): { entries: CsvEntry[]; errors: ImportError[]; rows: number } {
  const errors: ImportError[] = []
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy', transformHeader: (h) => h.trim() })
  const headers = parsed.meta.fields ?? []
  if (!headers.includes('scientificName')) {
    errors.push({ row: 1, column: 'scientificName', message: `The first row must name the columns, with scientificName among them (columns: ${CSV_COLUMNS.join(', ')})` })
    return { entries: [], errors, rows: parsed.data.length }
  }
  for (const h of headers) if (!KNOWN.has(h)) errors.push({ row: 1, column: h || '(blank)', message: `Unknown column "${h}"` })
  for (const e of parsed.errors) errors.push({ row: (e.row ?? 0) + 2, column: '', message: e.message })
  if (parsed.data.length > IMPORT_MAX_ROWS) {
    errors.push({ row: IMPORT_MAX_ROWS + 2, column: '', message: `At most ${IMPORT_MAX_ROWS} rows in one file` })
    return { entries: [], errors, rows: parsed.data.length }
  }
  const entries: CsvEntry[] = []
  const seen = new Map<string, number>()
  parsed.data.forEach((record, i) => {
    const row = i + 2
    const name = (record.scientificName ?? '').replace(/\s+/g, ' ').trim()
    const region = (record.region ?? '').trim().toUpperCase()
    const source = (record.source ?? '').trim() || 'coordinator'
    let ok = true
    const fail = (column: string, message: string) => { errors.push({ row, column, message }); ok = false }
    if (!/^[A-Z×][a-z×-]+( ×?[a-z][a-z-]*)?( (ssp\.|var\.|f\.) [a-z][a-z-]*)?$/.test(name)) fail('scientificName', name ? 'Write the name without authors, e.g. Asclepias tuberosa' : 'A scientific name is required')
    if (region && !REGIONS[region]) fail('region', 'Use a state or province code such as US-OH or CA-ON')
    if (!SOURCE_PATTERN.test(source)) fail('source', 'Name the source in plain words (at most 120 characters)')
    const values: CsvEntry['values'] = {}
    for (const column of DATA_COLUMNS) {
      const raw = record[column as CsvColumn]
      if (raw === undefined || raw.trim() === '') continue
      const r = parseCell(column, raw)
      if ('error' in r) fail(column, r.error)
      else values[column] = r.value
    }
    if (values.status !== undefined && !region) fail('status', 'A status is for one region: fill in the region column')
    const key = `${name.toLowerCase()}|${region}`
    if (seen.has(key)) fail('scientificName', `Same species${region ? ' and region' : ''} as row ${seen.get(key)}`)
    seen.set(key, row)
    if (ok) entries.push({ row, scientificName: name, region, source, values })
  })
  return { entries, errors, rows: parsed.data.length }
}

/** CSV text from rows keyed by column name (export). */
export function catalogueToCsv(columns: readonly string[], rows: Record<string, unknown>[]): string {
  // escapeFormulae: a cell starting with = + - @ is not run as a formula by a spreadsheet
  return Papa.unparse({ fields: [...columns], data: rows.map((r) => columns.map((c) => formatCell(r[c]))) }, { escapeFormulae: CSV_FORMULA_START })
}

function formatCell(v: unknown): string {
  if (v === null || v === undefined) return ''
  if (Array.isArray(v)) return v.join(';')
  if (typeof v === 'boolean') return v ? 'yes' : 'no'
  return String(v)
}
