import { z } from 'zod'
import { regionCode, hardinessZone } from './common'
import { LAYERS, REGION_STATUSES } from '../types/species'
import { SUN, SOIL, MOISTURE } from './yard-document'

// Query shapes of the species catalogue routes, and the coordinator's CSV columns.

const optional = <T extends z.ZodType>(s: T) => z.preprocess((v) => (v === '' || v === null ? undefined : v), s.optional())
const bool = z.preprocess((v) => (v === 'true' || v === '1' || v === true ? true : v === 'false' || v === '0' || v === false ? false : v), z.boolean())

export const SPECIES_SORTS = ['relevance', 'name', 'common', 'layer', 'height', 'spread', 'minZone', 'status'] as const
export const SPECIES_PAGE_SIZE = 50

export const speciesListQuery = z.object({
  region: optional(regionCode),
  q: optional(z.string().trim().max(100)),
  layer: optional(z.enum(LAYERS)),
  status: optional(z.enum(REGION_STATUSES)),
  sun: optional(z.enum(SUN)),
  moisture: optional(z.enum(MOISTURE)),
  soil: optional(z.enum(SOIL)),
  /** only species with USDA characteristics (sun, soil, bloom …) */
  hasFacts: optional(bool),
  sort: optional(z.enum(SPECIES_SORTS)),
  dir: optional(z.enum(['asc', 'desc'])),
  page: optional(z.coerce.number().int().min(1).max(10_000)),
  pageSize: optional(z.coerce.number().int().min(1).max(200)),
}).refine((q) => !q.status || q.region, { path: ['status'], message: 'Choose a region to filter by status' })

export const speciesNameParam = z.object({ name: z.string().trim().min(2).max(200) })
export const speciesDetailQuery = z.object({ region: optional(regionCode) })

export const fitsQuery = z.object({
  region: optional(regionCode),
  zone: optional(hardinessZone),
  sun: optional(z.enum(SUN)),
  soil: optional(z.enum(SOIL)),
  moisture: optional(z.enum(MOISTURE)),
  layer: optional(z.enum(LAYERS)),
  /** largest mature spread that fits, in metres */
  maxSpread: optional(z.coerce.number().positive().max(60)),
  yardId: optional(z.coerce.number().int().positive()),
  limit: optional(z.coerce.number().int().min(1).max(200)),
  /** the same page of both groups (known fit, site needs not recorded) */
  page: optional(z.coerce.number().int().min(1).max(1_000)),
}).refine((q) => q.region || q.yardId, { path: ['region'], message: 'Choose a region (or a yard)' })

export const swapsQuery = z.object({
  region: regionCode,
  zone: optional(hardinessZone),
  species: z.string().trim().min(2).max(200),
  sun: optional(z.enum(SUN)),
  soil: optional(z.enum(SOIL)),
  moisture: optional(z.enum(MOISTURE)),
  limit: optional(z.coerce.number().int().min(1).max(100)),
})

export const exportQuery = z.object({
  region: optional(regionCode),
  q: optional(z.string().trim().max(100)),
  layer: optional(z.enum(LAYERS)),
  status: optional(z.enum(REGION_STATUSES)),
}).refine((q) => !q.status || q.region, { path: ['status'], message: 'Choose a region to filter by status' })

export type SpeciesListQuery = z.infer<typeof speciesListQuery>
export type FitsQuery = z.infer<typeof fitsQuery>
export type SwapsQuery = z.infer<typeof swapsQuery>
export type ExportQuery = z.infer<typeof exportQuery>

/**
 * Columns of the coordinator's CSV (import and export share them). `scientificName` is required; a blank cell
 * changes nothing; `region` + `status` is a regional list entry; lengths are metres unless written with ft.
 */
export const CSV_COLUMNS = [
  'scientificName', 'region', 'status', 'commonName', 'layer', 'height', 'spread', 'spacing', 'sun', 'moisture', 'soil',
  'bloomMonths', 'minZone', 'toxicity', 'propagatedBySeed', 'coldStratification', 'coldMoistDays', 'seedNeedsLight',
  'scarify', 'hotWaterSoak', 'sowFresh', 'seedsPerPound', 'seedlingsPerPot', 'commercialAvailability', 'notes', 'source',
] as const
/** Columns the export adds for reading that the import accepts and ignores. */
export const CSV_READ_ONLY_COLUMNS = ['estimated', 'origin', 'usdaSymbol'] as const
export type CsvColumn = (typeof CSV_COLUMNS)[number]

/** Fields an override may set (every CSV column but the keys and the source). */
export type OverrideField = Exclude<CsvColumn, 'scientificName' | 'region' | 'source'>

export const IMPORT_MAX_BYTES = 5 * 1024 * 1024
export const IMPORT_MAX_ROWS = 30_000

export interface ImportError { row: number; column: string; message: string }
export interface ImportChange { row: number; scientificName: string; region: string; field: OverrideField; from: unknown; to: unknown }
export interface ImportPreview {
  rows: number
  errors: ImportError[]
  errorCount: number
  changes: ImportChange[]
  changeCount: number
  newSpecies: string[]
}

/** Where a coordinator's value comes from, in plain words (CSV `source` column and the edit form alike). */
export const SOURCE_PATTERN = /^[\p{L}\p{N} .,;:()'&/+-]{1,120}$/u
export const TOXICITY = ['none', 'slight', 'moderate', 'severe'] as const

const metres = (max: number) => z.number({ error: 'Enter a number of metres' }).positive('Must be more than 0').max(max, `At most ${max} m`)
const blankToUndefined = <T extends z.ZodType>(s: T) => z.preprocess((v) => (v === '' || v === null ? undefined : v), s.optional())

/**
 * The coordinator's form for one species: each field given replaces the catalogue's value (a blank leaves it);
 * `status` with `region` is the organization's regional list entry; `source` says where the values come from.
 */
export const speciesEditBody = z.object({
  commonName: blankToUndefined(z.string().trim().max(200, 'At most 200 characters')),
  layer: blankToUndefined(z.enum(LAYERS, 'Choose tree, shrub or ground')),
  height: blankToUndefined(metres(120)),
  spread: blankToUndefined(metres(60)),
  spacing: blankToUndefined(metres(20)),
  sun: z.array(z.enum(SUN)).max(3).optional(),
  moisture: z.array(z.enum(MOISTURE)).max(3).optional(),
  soil: z.array(z.enum(SOIL)).max(3).optional(),
  bloomMonths: z.array(z.number().int().min(1, 'Months are 1 to 12').max(12, 'Months are 1 to 12')).max(12).optional(),
  minZone: blankToUndefined(hardinessZone),
  toxicity: blankToUndefined(z.enum(TOXICITY, 'Choose none, slight, moderate or severe')),
  coldMoistDays: blankToUndefined(z.number({ error: 'Enter a whole number of days' }).int('Enter a whole number of days').min(0).max(365, 'At most 365 days')),
  seedsPerPound: blankToUndefined(z.number({ error: 'Enter a whole number' }).int('Enter a whole number').min(1).max(1e9)),
  commercialAvailability: blankToUndefined(z.string().trim().max(80, 'At most 80 characters')),
  notes: blankToUndefined(z.string().trim().max(1000, 'At most 1000 characters')),
  region: blankToUndefined(regionCode),
  status: blankToUndefined(z.enum(REGION_STATUSES)),
  source: z.string().trim().regex(SOURCE_PATTERN, 'Name the source in plain words (at most 120 characters), e.g. our 2026 regional list'),
}).refine((b) => !b.status || b.region, { path: ['region'], message: 'Choose the state or province this status is for' })

export type SpeciesEditBody = z.infer<typeof speciesEditBody>
export const SPECIES_EDIT_FIELDS = ['commonName', 'layer', 'height', 'spread', 'spacing', 'sun', 'moisture', 'soil', 'bloomMonths', 'minZone', 'toxicity', 'coldMoistDays', 'seedsPerPound', 'commercialAvailability', 'notes'] as const satisfies readonly OverrideField[]
