// The seed sale's catalogue side: sales, pickup events, lots (with CSV), the shop's listing and what lots grow.
import { and, asc, desc, eq, gte, lte } from 'drizzle-orm'
import Papa from 'papaparse'
import { seedSales, pickupEvents, seedLots } from '../database/schema'
import { getSpeciesDetails } from './catalogue'
import { speciesKey, tagTreatment, treatmentSteps, treatmentFacts } from '#shared/utils/seed-plan'
import { isoDate } from '#shared/utils/seed-season'
import { bloomWords, packetContents, saleIsOpen } from '#shared/utils/seed-sale'
import { parseMoney, formatMoney } from '#shared/utils/money'
import { lotBody, type LotBody, type SaleBody } from '#shared/schemas/sale'
import type { ImportError } from '#shared/schemas/species'
import type { SpeciesDetails } from '#shared/types/species'

export type SaleRow = typeof seedSales.$inferSelect
export type LotRow = typeof seedLots.$inferSelect

/** Catalogue facts are looked up for this region when a buyer names none (native status is then not shown). */
const DEFAULT_REGION = 'US-OH'
const NATIVE = new Set(['native', 'nativeAndIntroduced'])

export const today = () => isoDate(new Date())

/** The sale whose dates include today (paused or not), else the next one to open, else the last one. */
export async function currentSale(): Promise<SaleRow | null> {
  const db = useDb()
  const day = today()
  const [running] = await db.select().from(seedSales).where(and(lte(seedSales.opensOn, day), gte(seedSales.closesOn, day))).orderBy(desc(seedSales.opensOn)).limit(1)
  if (running) return running
  const [next] = await db.select().from(seedSales).where(gte(seedSales.opensOn, day)).orderBy(asc(seedSales.opensOn)).limit(1)
  if (next) return next
  const [last] = await db.select().from(seedSales).orderBy(desc(seedSales.closesOn)).limit(1)
  return last ?? null
}

/** The open sale, or a 400 saying why nothing can be bought now. */
export async function requireOpenSale(field = 'sale'): Promise<SaleRow> {
  const sale = await currentSale()
  if (!sale) throw invalidInput({ [field]: 'There is no seed sale' })
  if (sale.paused) throw invalidInput({ [field]: 'The seed sale is paused for now' })
  if (!saleIsOpen(sale, today())) throw invalidInput({ [field]: sale.opensOn > today() ? `The seed sale opens on ${sale.opensOn}` : `The seed sale closed on ${sale.closesOn}` })
  return sale
}

export async function saleById(id: number): Promise<SaleRow> {
  const [sale] = await useDb().select().from(seedSales).where(eq(seedSales.id, id)).limit(1)
  if (!sale) throw createError({ status: 404, message: 'No such sale' })
  return sale
}

export async function createSale(body: SaleBody): Promise<SaleRow> {
  const id = insertedId(await useDb().insert(seedSales).values(body).$returningId())
  return saleById(id)
}

export async function updateSale(id: number, body: SaleBody): Promise<SaleRow> {
  await saleById(id)
  await useDb().update(seedSales).set(body).where(eq(seedSales.id, id))
  return saleById(id)
}

export async function pickupsOf(saleId: number) {
  return useDb().select().from(pickupEvents).where(eq(pickupEvents.saleId, saleId)).orderBy(asc(pickupEvents.startsAt))
}

// ---------------------------------------------------------------------------------------------------------------
// What a lot grows, in words

/** The catalogue's treatment in words: one line and the steps. */
export function treatmentWords(d: SpeciesDetails | undefined) {
  if (!d) return { line: 'Treatment not recorded: ask the sale\'s volunteers.', steps: [] as string[] }
  const f = treatmentFacts(d)
  return { line: tagTreatment(f), steps: treatmentSteps(f) }
}

export interface LotView {
  id: number
  saleId: number
  scientificName: string
  commonName: string | null
  collected: string
  seedsPerPacket: number | null
  packetMilligrams: number | null
  contents: string
  priceMinor: number
  currency: string
  stock: number
  growingNotes: string | null
  /** the coordinator's notes, else the catalogue's treatment in one line */
  treatment: string
  sowingSteps: string[]
  layer: string | null
  bloomMonths: number[]
  bloom: string
  heightM: number | null
  status: string | null
  sun: string[]
  soil: string[]
  moisture: string[]
}

export async function lotViews(lots: LotRow[], currency: string, region = DEFAULT_REGION): Promise<LotView[]> {
  const details = lots.length ? await getSpeciesDetails([...new Set(lots.map((l) => l.scientificName))], region) : new Map<string, SpeciesDetails>()
  const byKey = new Map([...details.values()].map((d) => [speciesKey(d.scientificName), d]))
  return lots.map((l) => {
    const d = byKey.get(l.speciesKey)
    const words = treatmentWords(d)
    return {
      id: l.id, saleId: l.saleId, scientificName: l.scientificName, commonName: d?.commonName ?? null, collected: l.collected,
      seedsPerPacket: l.seedsPerPacket, packetMilligrams: l.packetMilligrams, contents: packetContents(l), priceMinor: l.priceMinor, currency,
      stock: l.stock, growingNotes: l.growingNotes, treatment: l.growingNotes || words.line, sowingSteps: l.growingNotes ? [l.growingNotes] : words.steps,
      layer: d?.layer ?? null, bloomMonths: d?.bloomMonths ?? [], bloom: bloomWords(d?.bloomMonths ?? []), heightM: d?.height ?? null,
      status: d?.status ?? null, sun: d?.sun ?? [], soil: d?.soil ?? [], moisture: d?.moisture ?? [],
    }
  })
}

export async function lotsOf(saleId: number): Promise<LotRow[]> {
  return useDb().select().from(seedLots).where(eq(seedLots.saleId, saleId)).orderBy(asc(seedLots.scientificName), asc(seedLots.id))
}

export interface ShopFilter { region?: string; sun?: string; soil?: string; moisture?: string }

/** The shop: the current sale, its pickups and its lots, filtered to natives of a region and a bed's conditions. */
export async function shop(filter: ShopFilter) {
  const sale = await currentSale()
  if (!sale) return { sale: null, open: false, pickups: [], lots: [] }
  const views = await lotViews(await lotsOf(sale.id), sale.currency, filter.region ?? DEFAULT_REGION)
  const lots = views.filter((l) => (!filter.region || NATIVE.has(l.status ?? ''))
    && (!filter.sun || l.sun.includes(filter.sun)) && (!filter.soil || l.soil.includes(filter.soil)) && (!filter.moisture || l.moisture.includes(filter.moisture)))
  return { sale, open: saleIsOpen(sale, today()), pickups: await pickupsOf(sale.id), lots, total: views.length }
}

// ---------------------------------------------------------------------------------------------------------------
// Lots

async function catalogueName(name: string, field = 'scientificName'): Promise<string> {
  const found = (await getSpeciesDetails([name], DEFAULT_REGION)).get(name.trim().toLowerCase())
  if (!found) throw invalidInput({ [field]: 'Not in the species catalogue' })
  return found.scientificName
}

export async function createLot(body: LotBody): Promise<LotRow> {
  await saleById(body.saleId)
  const scientificName = await catalogueName(body.scientificName)
  const db = useDb()
  const [r] = await db.insert(seedLots).ignore().values({ ...body, scientificName, speciesKey: speciesKey(scientificName) })
  if (r.affectedRows === 0) throw invalidInput({ collected: 'This sale already has a lot of this species from there' })
  const [lot] = await db.select().from(seedLots).where(eq(seedLots.id, r.insertId)).limit(1)
  return lot!
}

export async function updateLot(id: number, body: Partial<Omit<LotBody, 'saleId' | 'scientificName'>>): Promise<LotRow> {
  const db = useDb()
  const [lot] = await db.select().from(seedLots).where(eq(seedLots.id, id)).limit(1)
  if (!lot) throw createError({ status: 404, message: 'No such lot' })
  const merged = { ...lot, ...body }
  if (merged.seedsPerPacket === null && merged.packetMilligrams === null) throw invalidInput({ seedsPerPacket: 'Give seeds per packet or grams' })
  try {
    await db.update(seedLots).set(body).where(eq(seedLots.id, id))
  } catch (e) {
    if ((e as { cause?: { code?: string } }).cause?.code === 'ER_DUP_ENTRY') throw invalidInput({ collected: 'This sale already has a lot of this species from there' })
    throw e
  }
  return { ...lot, ...body } as LotRow
}

export const LOT_CSV_COLUMNS = ['species', 'collected', 'seeds_per_packet', 'grams_per_packet', 'price', 'stock', 'growing_notes'] as const

export async function lotsCsv(saleId: number): Promise<string> {
  const sale = await saleById(saleId)
  const rows = (await lotsOf(saleId)).map((l) => ({
    species: l.scientificName, collected: l.collected, seeds_per_packet: l.seedsPerPacket ?? '',
    grams_per_packet: l.packetMilligrams === null ? '' : l.packetMilligrams / 1000,
    price: formatMoney(l.priceMinor, sale.currency).replace(/[^\d.]/g, ''), stock: l.stock, growing_notes: l.growingNotes ?? '',
  }))
  return Papa.unparse({ fields: [...LOT_CSV_COLUMNS], data: rows.map((r) => LOT_CSV_COLUMNS.map((c) => r[c])) }, { escapeFormulae: true })
}

/** Reads and checks a lots CSV; every row error is listed (row numbers count the header as row 1). */
export async function readLotsCsv(saleId: number, text: string): Promise<{ lots: LotBody[]; errors: ImportError[] }> {
  const sale = await saleById(saleId)
  const parsed = Papa.parse<Record<string, string>>(text.replace(/^\uFEFF/, ''), { header: true, skipEmptyLines: 'greedy', transformHeader: (h) => h.trim().toLowerCase() })
  const errors: ImportError[] = []
  const missing = LOT_CSV_COLUMNS.filter((c) => c !== 'growing_notes' && c !== 'grams_per_packet' && c !== 'seeds_per_packet' && !parsed.meta.fields?.includes(c))
  if (missing.length) return { lots: [], errors: [{ row: 1, column: missing[0]!, message: `Missing column ${missing.join(', ')}` }] }
  if (parsed.data.length > 2000) return { lots: [], errors: [{ row: 1, column: '', message: 'At most 2,000 lots in one file' }] }
  const names = [...new Set(parsed.data.map((r) => (r.species ?? '').trim()).filter(Boolean))]
  const details = names.length ? await getSpeciesDetails(names, DEFAULT_REGION) : new Map()
  const lots: LotBody[] = []
  const seen = new Set<string>()
  parsed.data.forEach((r, i) => {
    const row = i + 2
    const num = (v: string | undefined) => (v ?? '').trim() === '' ? null : Number((v ?? '').trim())
    const grams = num(r.grams_per_packet)
    const price = parseMoney(r.price ?? '', sale.currency)
    if (price === null) { errors.push({ row, column: 'price', message: 'Write a price such as 3.50' }); return }
    const candidate = {
      saleId, scientificName: (r.species ?? '').trim(), collected: (r.collected ?? '').trim(), seedsPerPacket: num(r.seeds_per_packet),
      packetMilligrams: grams === null ? null : Math.round(grams * 1000), priceMinor: price, stock: num(r.stock),
      growingNotes: (r.growing_notes ?? '').trim() || null,
    }
    const check = lotBody.safeParse(candidate)
    if (!check.success) {
      const issue = check.error.issues[0]!
      const field = String(issue.path[0] ?? '')
      const column = ({ scientificName: 'species', seedsPerPacket: 'seeds_per_packet', packetMilligrams: 'grams_per_packet', priceMinor: 'price', growingNotes: 'growing_notes' } as Record<string, string>)[field] ?? field
      errors.push({ row, column, message: issue.message })
      return
    }
    const found = details.get(check.data.scientificName.toLowerCase())
    if (!found) { errors.push({ row, column: 'species', message: `"${check.data.scientificName}" is not in the species catalogue` }); return }
    const key = `${speciesKey(found.scientificName)}|${check.data.collected.toLowerCase()}`
    if (seen.has(key)) { errors.push({ row, column: 'collected', message: 'The same species and collection appear on an earlier row' }); return }
    seen.add(key)
    lots.push({ ...check.data, scientificName: found.scientificName })
  })
  return { lots, errors }
}

/** Applies a lots CSV in one transaction (new lots added, existing species + collection updated), or nothing. */
export async function importLots(saleId: number, text: string) {
  const { lots, errors } = await readLotsCsv(saleId, text)
  if (errors.length) {
    const first = errors[0]!
    throw createError({
      status: 400,
      message: `Nothing was changed: ${errors.length} row error${errors.length === 1 ? '' : 's'} (row ${first.row}, ${first.column || 'file'}: ${first.message})`,
      data: { errors, errorCount: errors.length, fields: { file: 'Fix the rows listed and upload again' } },
    })
  }
  await useDb().transaction(async (tx) => {
    for (const l of lots) {
      const { saleId: _s, ...values } = l
      await tx.insert(seedLots).values({ ...l, speciesKey: speciesKey(l.scientificName) })
        .onDuplicateKeyUpdate({ set: { seedsPerPacket: values.seedsPerPacket, packetMilligrams: values.packetMilligrams, priceMinor: values.priceMinor, stock: values.stock, growingNotes: values.growingNotes } })
    }
  })
  return { rows: lots.length }
}
