// The species catalogue: loading the committed USDA-derived file into MariaDB, the coordinator's overrides on top,
// an in-memory copy per app instance (kept fresh by a stamp row in app_meta that every change bumps), lookups for
// the score engine and the seed plan, the species table, good fits and swaps, and CSV import/export.
import { gunzipSync } from 'node:zlib'
import type { H3Event } from 'h3'
import { eq, sql } from 'drizzle-orm'
import { format as formatSql } from 'mysql2'
import { appMeta, catalogueOverrides, catalogueRegions, catalogueSpecies, type CatalogueSpeciesData } from '../database/schema'
import type { Layer, RegionStatus, SpeciesDetails, SpeciesFacts } from '#shared/types/species'
import {
  COORDINATOR, USDA, speciesOf, zoneIndex, refreshEstimates, type CatalogueEntry,
} from '#shared/utils/catalogue-rules'
import { readCatalogueCsv, catalogueToCsv } from '#shared/utils/catalogue-csv'
import {
  CSV_COLUMNS, IMPORT_MAX_BYTES, type ExportQuery, type ImportChange, type ImportError, type ImportPreview,
  type OverrideField, type SpeciesListQuery,
} from '#shared/schemas/species'
import { REGIONS } from '#shared/utils/regions'
import { buildSearchIndex, buildTableIndex, namedMask, searchPage, tablePage, type CachedSpecies, type SearchIndex, type TableIndex } from './catalogue-index'
import { buildRegionFits, rankFits, rankSwaps, type FitConditions, type FitItem, type FitsAnswer, type RegionFits, type YardContext } from './catalogue-fits'
import { compareNames, nameKey } from '#shared/utils/species-name'
import { sowFreshOf } from '#shared/utils/seed-fresh'

export { BLOOM_SEASON } from './catalogue-fits'
export type { CachedSpecies } from './catalogue-index'
export type { FitConditions, FitItem, YardContext } from './catalogue-fits'

type Tx = Parameters<Parameters<Db['transaction']>[0]>[0]
type Executor = Db | Tx

export const CATALOGUE_STAMP_KEY = 'catalogue/current'
// how long an instance trusts its copy before re-reading the stamp (another instance may have imported)
const STAMP_TTL_MS = 1000
const SPECIES_CHUNK = 500
const REGION_CHUNK = 5000

interface CatalogueFile { header: { format: string; version: string; source: string; counts: Record<string, number> }; species: CatalogueEntry[] }

let fileCache: Promise<CatalogueFile> | null = null

/** The committed catalogue (server/assets/catalogue/catalogue.json.gz), bundled into the server build; read once. */
export function readCatalogueFile(): Promise<CatalogueFile> {
  fileCache ??= readCatalogueAsset()
  fileCache.catch(() => { fileCache = null })
  return fileCache
}

async function readCatalogueAsset(): Promise<CatalogueFile> {
  const raw = await useStorage('assets:server').getItemRaw('catalogue/catalogue.json.gz')
  if (!raw) throw new Error('server/assets/catalogue/catalogue.json.gz is missing: run npm run catalogue:build')
  return JSON.parse(gunzipSync(Buffer.from(raw as Uint8Array)).toString('utf8')) as CatalogueFile
}

function rowOf(data: CatalogueSpeciesData, origin: 'usda' | 'coordinator') {
  return {
    scientificName: data.scientificName,
    commonName: data.commonName,
    layer: data.layer,
    height: data.height,
    spread: data.spread,
    sun: data.sun.join(','),
    moisture: data.moisture.join(','),
    soil: data.soil.join(','),
    bloomMonths: data.bloomMonths.join(','),
    minZone: data.minZone,
    minZoneIndex: zoneIndex(data.minZone),
    toxic: data.toxic,
    hasFacts: data.hasCharacteristics,
    origin,
    data: { estimated: data.estimated, spacing: data.spacing },
  }
}

/** Multi-row INSERT formatted client-side: one round trip per chunk and no per-row ORM work (start-up speed). */
async function bulkInsert(tx: Tx, table: string, columns: string[], rows: unknown[][], chunk: number) {
  for (let i = 0; i < rows.length; i += chunk) {
    await tx.execute(sql.raw(formatSql(`insert into \`${table}\` (${columns.map((c) => `\`${c}\``).join(', ')}) values ?`, [rows.slice(i, i + chunk) as never])))
  }
}

/**
 * Replaces the USDA base with the file's contents, the coordinator's overrides applied. Runs inside
 * onceAcrossInstances, so one instance does it per catalogue version while the others wait and skip.
 */
export async function loadCatalogueBase(tx: Tx, file: CatalogueFile) {
  await tx.delete(catalogueRegions)
  await tx.delete(catalogueSpecies)
  const overrides = groupOverrides(await tx.select().from(catalogueOverrides))
  const species = file.species
  const speciesRows = species.map((e, i) => {
    const r = rowOf(withOverrides(e, overrides.get(nameKey(e.scientificName))), 'usda')
    return [i + 1, r.scientificName, r.commonName, r.layer, r.height, r.spread, r.sun, r.moisture, r.soil, r.bloomMonths, r.minZone, r.minZoneIndex, r.toxic, r.hasFacts, r.origin, JSON.stringify(r.data)]
  })
  await bulkInsert(tx, 'catalogue_species', ['id', 'scientific_name', 'common_name', 'layer', 'height_m', 'spread_m', 'sun', 'moisture', 'soil', 'bloom_months', 'min_zone', 'min_zone_index', 'toxic', 'has_facts', 'origin', 'data'], speciesRows, 2000)
  const regionRows: unknown[][] = []
  species.forEach((e, i) => { for (const [region, status] of Object.entries(e.regions)) regionRows.push([region, i + 1, status, USDA]) })
  await bulkInsert(tx, 'catalogue_regions', ['region', 'species_id', 'status', 'source'], regionRows, 10_000)
  // coordinator species and regional statuses on top
  const known = new Set(species.map((e) => nameKey(e.scientificName)))
  await materialize(tx, [...overrides.entries()].filter(([k]) => !known.has(k)).flatMap(([, list]) => list), new Map())
  await writeRegionOverrides(tx, [...overrides.values()].flat(), new Map(species.map((e, i) => [nameKey(e.scientificName), i + 1])))
  await bumpStamp(tx, file.header.version)
}

/**
 * The demo organisation's regional list (demo data, invented): entries the 2015 noxious lists lack, as a real
 * coordinator would add them (USDA's README: state invasive lists are longer than the 2015 composite).
 */
export const DEMO_REGIONAL_LIST: OverrideRow[] = [
  { scientificName: 'Berberis thunbergii', region: 'US-OH', field: 'status', value: 'invasive', source: 'coordinator (demo regional list)' },
  { scientificName: 'Lonicera maackii', region: 'US-OH', field: 'status', value: 'invasive', source: 'coordinator (demo regional list)' },
]

/** Start-up: load this build's catalogue once across instances (and the demo list in demo mode), then warm this instance's copy. */
export async function ensureCatalogue(demo = false) {
  const file = await readCatalogueFile()
  try {
    await onceAcrossInstances(`catalogue/${file.header.version}`, (tx) => loadCatalogueBase(tx, file))
  } catch (e) {
    // drizzle's "Failed query" hides the database's own words in `cause`
    throw new Error(`loading catalogue ${file.header.version} failed: ${(e as Error).message.slice(0, 200)}: ${((e as Error).cause as Error | undefined)?.message ?? ''}`)
  }
  if (demo) {
    await onceAcrossInstances('catalogue/demo-list/1', async (tx) => {
      await tx.insert(catalogueOverrides).ignore().values(DEMO_REGIONAL_LIST)
      await materialize(tx, DEMO_REGIONAL_LIST, (await useCatalogue()).byKey)
      await bumpStamp(tx)
    })
  }
  await useCatalogue()
}

async function bumpStamp(db: Executor, version?: string) {
  const [row] = await db.select({ value: appMeta.value }).from(appMeta).where(eq(appMeta.key, CATALOGUE_STAMP_KEY))
  const prev = (row?.value ?? {}) as { version?: string; revision?: number }
  const value = { version: version ?? prev.version ?? null, revision: (prev.revision ?? 0) + 1, at: new Date().toISOString() }
  await db.insert(appMeta).values({ key: CATALOGUE_STAMP_KEY, value }).onDuplicateKeyUpdate({ set: { value } })
  stampCheckedAt = 0
}

// ---------------------------------------------------------------------------------------------------------
// The in-memory copy

interface Catalogue {
  stamp: string
  list: CachedSpecies[]
  byKey: Map<string, CachedSpecies>
  byId: Map<number, CachedSpecies>
  regions: Map<string, Promise<Map<number, RegionStatus>>>
  /** precomputed per copy (catalogue-index.ts); a new stamp makes a new copy, so these never outlive their data */
  table: TableIndex
  search: SearchIndex
  fits: Map<string, Promise<RegionFits>>
}

let cache: Catalogue | null = null
let building: { stamp: string; promise: Promise<Catalogue> } | null = null
let stamp = ''
let stampCheckedAt = 0

async function currentStamp(): Promise<string> {
  if (Date.now() - stampCheckedAt < STAMP_TTL_MS) return stamp
  const [row] = await useDb().select({ value: appMeta.value }).from(appMeta).where(eq(appMeta.key, CATALOGUE_STAMP_KEY))
  stamp = JSON.stringify(row?.value ?? null)
  stampCheckedAt = Date.now()
  return stamp
}

async function buildCatalogue(forStamp: string): Promise<Catalogue> {
  const db = useDb()
  const [file, ids, overrideRows] = await Promise.all([
    readCatalogueFile(),
    db.select({ id: catalogueSpecies.id, name: catalogueSpecies.scientificName, origin: catalogueSpecies.origin }).from(catalogueSpecies),
    db.select().from(catalogueOverrides),
  ])
  const overrides = groupOverrides(overrideRows)
  const entries = new Map<string, Omit<CatalogueEntry, 'regions'>>()
  for (const e of file.species) entries.set(nameKey(e.scientificName), e)
  const list: CachedSpecies[] = []
  for (const row of ids) {
    const key = nameKey(row.name)
    const own = overrides.get(key)
    const base = entries.get(key) ?? (row.origin === 'coordinator' ? newCoordinatorSpecies(row.name, (own?.find((o) => o.field === 'layer' && o.region === '')?.value as Layer) ?? 'ground') : undefined)
    if (!base) continue
    const data = withOverrides(base, own)
    list.push({ id: row.id, origin: row.origin, minZoneIndex: zoneIndex(data.minZone), key, data })
  }
  const table = buildTableIndex(list)
  return {
    stamp: forStamp, list, byKey: new Map(list.map((s) => [s.key, s])), byId: new Map(list.map((s) => [s.id, s])), regions: new Map(),
    table, search: buildSearchIndex(table), fits: new Map(),
  }
}

/** This instance's copy of the catalogue, rebuilt when the stamp row says the database changed. */
export async function useCatalogue(): Promise<Catalogue> {
  // while the database is unreachable the copy in hand keeps answering (it cannot have changed meanwhile)
  const s = await currentStamp().catch((e) => { if (cache && isDatabaseUnreachable(e)) return cache.stamp; throw e })
  if (cache && cache.stamp === s) return cache
  if (!building || building.stamp !== s) {
    const promise = buildCatalogue(s).then((c) => { if (building?.stamp === s) { cache = c; building = null } return c })
    promise.catch(() => { if (building?.stamp === s) building = null })
    building = { stamp: s, promise }
  }
  return building.promise
}

/** Status per species id in one region (absent ones are missing). */
export function regionStatuses(cat: Catalogue, region: string): Promise<Map<number, RegionStatus>> {
  let p = cat.regions.get(region)
  if (!p) {
    p = useDb().select({ id: catalogueRegions.speciesId, status: catalogueRegions.status }).from(catalogueRegions)
      .where(eq(catalogueRegions.region, region))
      .then((rows) => new Map(rows.map((r) => [r.id, r.status])))
    p.catch(() => cat.regions.delete(region))
    cat.regions.set(region, p)
  }
  return p
}

/** A region's natives pre-ranked for fits and swaps, made once per region per catalogue copy. */
function regionFits(cat: Catalogue, region: string): Promise<RegionFits> {
  let p = cat.fits.get(region)
  if (!p) {
    p = regionStatuses(cat, region).then((statuses) => buildRegionFits(statuses, cat.byId))
    p.catch(() => cat.fits.delete(region))
    cat.fits.set(region, p)
  }
  return p
}

/** A species by name: exact (case, spacing, hybrid sign and a quoted cultivar ignored), else its species. */
export function findSpecies(cat: Catalogue, name: string): CachedSpecies | undefined {
  const key = nameKey(name)
  return cat.byKey.get(key) ?? cat.byKey.get(speciesOf(key))
}

const FACT_ESTIMATES = ['spread', 'height', 'spacing'] as const

export function factsOf(s: CachedSpecies, status: RegionStatus): SpeciesFacts {
  const d = s.data
  return {
    scientificName: d.scientificName, commonName: d.commonName, layer: d.layer, status,
    spread: d.spread, height: d.height, spacing: d.spacing, lawn: d.lawn, growthRate: d.growthRate ?? null,
    estimated: FACT_ESTIMATES.filter((f) => d.estimated.includes(f)), toxic: d.toxic,
  }
}

export function detailsOf(s: CachedSpecies, status: RegionStatus): SpeciesDetails {
  const d = s.data
  const fresh = sowFreshOf(d)
  return {
    ...factsOf(s, status),
    family: d.family, growthHabit: d.growthHabit, bloomMonths: d.bloomMonths, minZone: d.minZone,
    sun: d.sun, moisture: d.moisture, soil: d.soil, toxicity: d.toxicity,
    propagatedBySeed: d.propagatedBySeed, coldStratification: d.coldStratification, coldMoistDays: d.coldMoistDays,
    seedNeedsLight: d.seedNeedsLight, scarify: d.scarify, hotWaterSoak: d.hotWaterSoak, seedsPerPound: d.seedsPerPound,
    seedlingsPerPot: d.seedlingsPerPot, commercialAvailability: d.commercialAvailability, wildlife: d.wildlife,
    sowFresh: fresh.value, sources: { ...d.sources, sowFresh: fresh.source }, estimatedFields: d.estimated, noxiousIn: d.noxiousIn, notes: d.notes ?? null,
    usdaSymbol: d.symbol || null, origin: s.origin, hasFacts: d.hasCharacteristics, flowerConspicuous: d.flowerConspicuous,
    duration: d.duration,
  }
}

/** Facts for the score engine, keyed by the lower-cased name as given; names not in the catalogue are left out. */
export async function speciesFactsFor(names: Iterable<string>, region: string): Promise<Map<string, SpeciesFacts>> {
  const cat = await useCatalogue()
  const statuses = await regionStatuses(cat, region)
  const out = new Map<string, SpeciesFacts>()
  for (const name of names) {
    const s = findSpecies(cat, name)
    if (s) out.set(nameKey(name), factsOf(s, statuses.get(s.id) ?? 'absent'))
  }
  return out
}

/** Everything known of each named species in a region (seed plan, species page, fits), keyed by `nameKey`. */
export async function getSpeciesDetails(names: string[], region: string): Promise<Map<string, SpeciesDetails>> {
  const cat = await useCatalogue()
  const statuses = await regionStatuses(cat, region)
  const out = new Map<string, SpeciesDetails>()
  for (const name of names) {
    const s = findSpecies(cat, name)
    if (s) out.set(nameKey(name), detailsOf(s, statuses.get(s.id) ?? 'absent'))
  }
  return out
}

// ---------------------------------------------------------------------------------------------------------
// The species table and search-as-you-type, from this instance's in-memory copy (catalogue-index.ts): one
// matching rule (shared/utils/species-name.ts) and sort orders made once per copy

export async function listSpecies(q: SpeciesListQuery) {
  const cat = await useCatalogue()
  const statuses = q.region ? await regionStatuses(cat, q.region) : new Map<number, RegionStatus>()
  if (q.q && (!q.sort || q.sort === 'relevance')) return searchPage(cat.search, q as SpeciesListQuery & { q: string }, statuses)
  return tablePage(cat.table, q, statuses, q.q ? namedMask(cat.search, q.q) : undefined)
}

/** One species with where it grows and the coordinator's overrides, or null. */
export async function speciesPage(name: string, region?: string) {
  const cat = await useCatalogue()
  const s = cat.byKey.get(nameKey(name.replace(/[_+]/g, ' ')))
  if (!s) return null
  const db = useDb()
  const [regions, overrides] = await Promise.all([
    db.select({ region: catalogueRegions.region, status: catalogueRegions.status, source: catalogueRegions.source }).from(catalogueRegions).where(eq(catalogueRegions.speciesId, s.id)),
    db.select({ region: catalogueOverrides.region, field: catalogueOverrides.field, value: catalogueOverrides.value, source: catalogueOverrides.source, updatedAt: catalogueOverrides.updatedAt })
      .from(catalogueOverrides).where(eq(catalogueOverrides.scientificName, s.data.scientificName)),
  ])
  const status = region ? (regions.find((r) => r.region === region)?.status ?? 'absent') : 'absent'
  const named = regions.map((r) => ({ ...r, name: REGIONS[r.region] ?? r.region })).sort((a, b) => compareNames(a.name, b.name))
  return {
    ...detailsOf(s, status),
    region: region ?? null,
    status: region ? status : null,
    usdaName: s.data.usdaName,
    nativeIn: named.filter((r) => r.status === 'native').map((r) => r.region),
    regions: named,
    overrides,
  }
}

// ---------------------------------------------------------------------------------------------------------
// Good fits and swaps, over the in-memory copy (ranking in catalogue-index.ts)

/** Native species that fit a spot, best first: those with a known fit, and those whose site needs are not recorded. */
export async function findFits(c: FitConditions, yard: YardContext | null, limit = 50, page = 1): Promise<FitsAnswer> {
  const cat = await useCatalogue()
  return rankFits(await regionFits(cat, c.region), c, yard, limit, page)
}

/** What a yard's native plantings already give: bloom months and layers. */
export async function yardContext(plantingNames: string[], region: string): Promise<YardContext> {
  const details = await getSpeciesDetails(plantingNames, region)
  const ctx: YardContext = { bloomMonths: new Set(), layers: new Set() }
  for (const d of details.values()) {
    if (d.status !== 'native') continue
    ctx.layers.add(d.layer)
    if (d.flowerConspicuous !== false) for (const m of d.bloomMonths) ctx.bloomMonths.add(m)
  }
  return ctx
}

/** Natives of the same layer and similar size (half to twice the height) for a species, or null when unknown. */
export async function findSwaps(name: string, c: Omit<FitConditions, 'layer' | 'maxSpread'>, limit = 20) {
  const cat = await useCatalogue()
  const target = findSpecies(cat, name)
  if (!target) return null
  const statuses = await regionStatuses(cat, c.region)
  const targetStatus = statuses.get(target.id) ?? 'absent'
  const species = { scientificName: target.data.scientificName, commonName: target.data.commonName, status: targetStatus, layer: target.data.layer, height: target.data.height, spread: target.data.spread }
  if (targetStatus === 'native') return { species, items: [] as FitItem[] }
  return { species, items: rankSwaps(await regionFits(cat, c.region), target, c, limit) }
}

// ---------------------------------------------------------------------------------------------------------
// Coordinator overrides: CSV preview and apply, materializing into the species and region tables

export type OverrideRow = Pick<typeof catalogueOverrides.$inferSelect, 'scientificName' | 'region' | 'field' | 'value' | 'source'>

export function sameValue(a: unknown, b: unknown) {
  return JSON.stringify(a ?? null) === JSON.stringify(b ?? null)
}

export function currentValue(data: CatalogueSpeciesData, field: OverrideField): unknown {
  if (field === 'sowFresh') return sowFreshOf(data).value
  return (data as unknown as Record<string, unknown>)[field] ?? null
}

interface ImportPlan { preview: ImportPreview; overrides: OverrideRow[] }

const MAX_LISTED = 500

/** Reads the CSV and works out what would change, without writing anything. */
export async function planImport(text: string): Promise<ImportPlan> {
  const { entries, errors, rows } = readCatalogueCsv(text)
  stampCheckedAt = 0
  const cat = await useCatalogue()
  const changes: ImportChange[] = []
  const overrides: OverrideRow[] = []
  const newSpecies = new Set<string>()
  const layerGiven = new Set(entries.filter((e) => e.values.layer !== undefined).map((e) => nameKey(e.scientificName)))
  const factSetAt = new Map<string, { row: number; value: unknown }>()
  const planned = new Set<string>()
  for (const e of entries) {
    let conflict = false
    for (const [field, value] of Object.entries(e.values)) {
      if (field === 'status') continue
      const k = `${nameKey(e.scientificName)}|${field}`
      const prev = factSetAt.get(k)
      if (prev && !sameValue(prev.value, value)) { errors.push({ row: e.row, column: field, message: `Row ${prev.row} gives this species a different ${field}` }); conflict = true }
      else factSetAt.set(k, { row: e.row, value })
    }
    if (conflict) continue
    const s = cat.byKey.get(nameKey(e.scientificName))
    const name = s?.data.scientificName ?? e.scientificName
    if (!s) {
      if (!layerGiven.has(nameKey(e.scientificName))) {
        errors.push({ row: e.row, column: 'layer', message: `${e.scientificName} is not in the catalogue: give its layer (tree, shrub or ground) to add it` })
        continue
      }
      newSpecies.add(e.scientificName)
    }
    const statuses = e.region ? await regionStatuses(cat, e.region) : null
    for (const [field, to] of Object.entries(e.values) as [OverrideField, unknown][]) {
      const from = field === 'status' ? (s ? statuses!.get(s.id) ?? 'absent' : 'absent') : s ? currentValue(s.data, field) : null
      if (s && sameValue(from, to)) continue
      // a row's region is for its status; its other facts hold everywhere
      const region = field === 'status' ? e.region : ''
      const planKey = `${nameKey(name)}|${region}|${field}`
      if (planned.has(planKey)) continue
      planned.add(planKey)
      changes.push({ row: e.row, scientificName: name, region, field, from, to })
      overrides.push({ scientificName: name, region, field, value: to, source: e.source })
    }
  }
  errors.sort((a, b) => a.row - b.row)
  return {
    preview: { rows, errors: errors.slice(0, MAX_LISTED), errorCount: errors.length, changes: changes.slice(0, MAX_LISTED), changeCount: changes.length, newSpecies: [...newSpecies] },
    overrides,
  }
}

/** Applies a CSV all-or-nothing: any row error writes nothing; the writes share one transaction. */
export async function applyImport(text: string, userId: number) {
  const plan = await planImport(text)
  if (plan.preview.errorCount) return { applied: false as const, preview: plan.preview }
  await applyOverrides(plan.overrides, userId)
  return { applied: true as const, preview: plan.preview }
}

/** Stores the coordinator's overrides and writes them through to the species and region tables, in one transaction. */
export async function applyOverrides(overrides: OverrideRow[], userId: number) {
  await useDb().transaction(async (tx) => {
    for (let i = 0; i < overrides.length; i += 1000) {
      await tx.insert(catalogueOverrides).values(overrides.slice(i, i + 1000).map((o) => ({ ...o, createdBy: userId })))
        .onDuplicateKeyUpdate({ set: { value: sql`values(${catalogueOverrides.value})`, source: sql`values(${catalogueOverrides.source})`, createdBy: userId } })
    }
    await materialize(tx, overrides, (await useCatalogue()).byKey)
    await bumpStamp(tx)
  })
  stampCheckedAt = 0
}

function groupOverrides(rows: OverrideRow[]): Map<string, OverrideRow[]> {
  const byName = new Map<string, OverrideRow[]>()
  for (const o of rows) {
    const k = nameKey(o.scientificName)
    let list = byName.get(k)
    if (!list) byName.set(k, (list = []))
    list.push(o)
  }
  return byName
}

/** A species' facts with the coordinator's field overrides (region '') applied; the base is not changed. */
export function withOverrides(base: Omit<CatalogueEntry, 'regions'> | CatalogueSpeciesData, overrides: OverrideRow[] | undefined): CatalogueSpeciesData {
  const { regions: _, ...plain } = base as CatalogueEntry
  const facts = (overrides ?? []).filter((o) => o.region === '')
  if (!facts.length) return plain
  const data: CatalogueSpeciesData = structuredClone(plain)
  const record = data as unknown as Record<string, unknown>
  const changed = new Set<string>()
  for (const o of facts) {
    changed.add(o.field)
    record[o.field] = o.value
    data.sources[o.field] = o.source
    data.estimated = data.estimated.filter((f) => f !== o.field)
    if (o.field === 'toxicity') { data.toxic = o.value !== 'none'; data.sources.toxic = o.source }
  }
  refreshEstimates(data, changed)
  return data
}

/** Region statuses from overrides into catalogue_regions. */
async function writeRegionOverrides(tx: Tx, overrides: OverrideRow[], idByKey: Map<string, number>) {
  for (const o of overrides) {
    if (o.region === '' || o.field !== 'status') continue
    const id = idByKey.get(nameKey(o.scientificName))
    if (!id) continue
    const status = o.value as RegionStatus
    await tx.insert(catalogueRegions).values({ region: o.region, speciesId: id, status, source: o.source })
      .onDuplicateKeyUpdate({ set: { status, source: o.source } })
  }
}

/**
 * Writes changed species into catalogue_species (creating coordinator species) and their region statuses.
 * `current` holds the in-memory facts of species already known (by name key); `overrides` are the new rows.
 */
async function materialize(tx: Tx, overrides: OverrideRow[], current: Map<string, CachedSpecies>) {
  if (!overrides.length) return
  const byName = groupOverrides(overrides)
  const idByKey = new Map<string, number>()
  for (const [key, list] of byName) {
    const known = current.get(key)
    let id = known?.id
    const facts = list.filter((o) => o.region === '')
    if (!known) {
      const [existing] = await tx.select({ id: catalogueSpecies.id }).from(catalogueSpecies).where(eq(catalogueSpecies.scientificName, list[0]!.scientificName))
      id = existing?.id
      const layer = facts.find((o) => o.field === 'layer')?.value as Layer | undefined
      if (!id && layer) {
        const data = withOverrides(newCoordinatorSpecies(list[0]!.scientificName, layer), facts)
        id = insertedId(await tx.insert(catalogueSpecies).values(rowOf(data, 'coordinator')).$returningId())
      }
    } else if (facts.length) {
      await tx.update(catalogueSpecies).set(rowOf(withOverrides(known.data, facts), known.origin)).where(eq(catalogueSpecies.id, known.id))
    }
    if (id) idByKey.set(key, id)
  }
  await writeRegionOverrides(tx, overrides, idByKey)
}

function newCoordinatorSpecies(name: string, layer: Layer): CatalogueSpeciesData {
  const data: CatalogueSpeciesData = {
    scientificName: name, usdaName: null, commonName: null, symbol: '', family: null, genus: name.split(' ')[0] ?? null,
    growthHabit: null, duration: null, layer, height: 0, spread: 0, spacing: null, lawn: false, sun: [], moisture: [], soil: [],
    bloomMonths: [], flowerConspicuous: null, minTemperatureF: null, minZone: null, toxic: false, toxicity: null,
    propagatedBySeed: null, coldStratification: null, coldMoistDays: null, seedNeedsLight: null, scarify: false,
    hotWaterSoak: false, seedsPerPound: null, seedlingsPerPot: null, commercialAvailability: null, wildlife: [], noxiousIn: [],
    hasCharacteristics: false, sources: { layer: COORDINATOR }, estimated: ['height', 'spread', 'spacing', 'seedNeedsLight', 'scarify', 'hotWaterSoak', 'seedlingsPerPot'],
  }
  refreshEstimates(data, ['layer', 'height', 'spread', 'spacing', 'seedsPerPound', 'coldStratification'])
  return data
}

// ---------------------------------------------------------------------------------------------------------
// Export

export async function exportCsv(q: ExportQuery): Promise<string> {
  const cat = await useCatalogue()
  const statuses = q.region ? await regionStatuses(cat, q.region) : null
  const named = q.q ? namedMask(cat.search, q.q) : null
  const rows: Record<string, unknown>[] = []
  for (const [i, s] of cat.list.entries()) {
    const d = s.data
    if (q.layer && d.layer !== q.layer) continue
    if (named && !named[i]) continue
    const status = statuses ? statuses.get(s.id) ?? 'absent' : null
    if (q.status && status !== q.status) continue
    const record: Record<string, unknown> = { ...d, sowFresh: sowFreshOf(d).value, region: q.region ?? '', status, source: '', estimated: d.estimated, origin: s.origin, usdaSymbol: d.symbol }
    rows.push(record)
  }
  rows.sort((a, b) => compareNames(String(a.scientificName), String(b.scientificName)))
  return catalogueToCsv([...CSV_COLUMNS, 'estimated', 'origin', 'usdaSymbol'], rows)
}

export type { ImportError }

/**
 * The uploaded CSV as text: text/csv or text/plain, at most IMPORT_MAX_BYTES, valid UTF-8 with no NUL bytes
 * (a spreadsheet saved as .xlsx or any binary fails here, before parsing).
 */
export async function readCsvUpload(event: H3Event): Promise<string> {
  const type = (getRequestHeader(event, 'content-type') ?? '').split(';')[0]!.trim().toLowerCase()
  if (type !== 'text/csv' && type !== 'text/plain') throw createError({ status: 415, message: 'Upload the file as CSV (text/csv)', data: { fields: { file: 'Save the sheet as CSV (UTF-8) and upload that' } } })
  const declared = Number(getRequestHeader(event, 'content-length') ?? 0)
  const tooBig = () => createError({ status: 413, message: `The file is larger than ${IMPORT_MAX_BYTES / 1024 / 1024} MB`, data: { fields: { file: 'Split the file into smaller ones' } } })
  if (declared > IMPORT_MAX_BYTES) throw tooBig()
  const body = await readRawBody(event, false)
  if (!body || body.length === 0) throw createError({ status: 400, message: 'The file is empty', data: { fields: { file: 'The file is empty' } } })
  if (body.length > IMPORT_MAX_BYTES) throw tooBig()
  let text: string
  try {
    text = new TextDecoder('utf-8', { fatal: true }).decode(body)
  } catch {
    throw createError({ status: 400, message: 'The file is not UTF-8 text', data: { fields: { file: 'Save the sheet as CSV (UTF-8)' } } })
  }
  if (text.includes('\u0000')) throw createError({ status: 400, message: 'The file is not a CSV text file', data: { fields: { file: 'Save the sheet as CSV (UTF-8)' } } })
  return text
}
