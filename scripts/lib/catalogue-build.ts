// Reads the USDA PLANTS exports in a folder and joins them into catalogue entries. Used by
// scripts/build-catalogue.ts and by the tests (on the committed reference extract and, when present, the full data).
// Every mapping rule lives in shared/utils/catalogue-rules.ts; this file only reads and joins.
import { existsSync, readFileSync } from 'node:fs'
import { gunzipSync } from 'node:zlib'
import { join } from 'node:path'
import Papa from 'papaparse'
import {
  bareName, deriveFacts, parseNativeStatus, parseNoxiousStates, regionCodeForStateName, regionStatus,
  USDA, type AreaStatus, type CatalogueEntry, type CharacteristicsRow,
} from '../../shared/utils/catalogue-rules'
import { REGIONS } from '../../shared/utils/regions'
import { withRangeHardiness } from '../../shared/utils/region-zones'
import { nameKey } from '../../shared/utils/species-name'

export const CATALOGUE_FORMAT = 'wildward.catalogue/1'
const NON_VASCULAR = new Set(['Lichen', 'Moss', 'Liverwort', 'Hornwort', 'Green Algae', 'Red Algae', 'Brown Algae'])

/** A file of the export as rows: `<name>.csv.gz` as shipped, or `<name>.csv` (the tests' extract). */
export function readUsdaCsv(dataDir: string, name: string): Record<string, string>[] {
  const gz = join(dataDir, `${name}.csv.gz`)
  const text = existsSync(gz) ? gunzipSync(readFileSync(gz)).toString('utf8') : readFileSync(join(dataDir, `${name}.csv`), 'utf8')
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true })
  if (parsed.errors.length) console.warn(`${name}: ${parsed.errors.length} parse warnings (first: ${parsed.errors[0]!.message})`)
  return parsed.data
}

export interface BuildResult { entries: CatalogueEntry[]; fallbackStatus: number }

export function buildCatalogueEntries(dataDir: string): BuildResult {
  const plants = readUsdaCsv(dataDir, 'plants')
  const characteristics = new Map(readUsdaCsv(dataDir, 'plant_characteristics').map((r) => [r.symbol!, r as CharacteristicsRow]))
  const nativeStatus = new Map<string, Record<string, AreaStatus>>()
  for (const r of readUsdaCsv(dataDir, 'plant_native_status_codes')) {
    const key = nameKey(bareName(r.scientificName!))
    const parsed = parseNativeStatus(r.nativeStatus ?? '')
    // the file repeats a few rows verbatim; two different statuses under one name would be a name-reading bug
    // (or once with NA beside a coded row: the coded row wins)
    const prev = nativeStatus.get(key)
    if (prev && Object.keys(prev).length && Object.keys(parsed).length && JSON.stringify(prev) !== JSON.stringify(parsed)) throw new Error(`two native-status rows read as one name: ${r.scientificName} (${key})`)
    if (!prev || !Object.keys(prev).length) nativeStatus.set(key, parsed)
  }
  const usStates = Object.keys(REGIONS).filter((c) => c.startsWith('US-'))
  const noxious = new Map<string, Set<string>>()
  for (const r of readUsdaCsv(dataDir, 'noxious_composite_2015')) {
    const bare = bareName(r['Scientific Name'] ?? '')
    // genus-only rows ("Berberis L.") carry footnotes limiting them to some species: not expanded
    if (bare.split(' ').length < 2) continue
    const regions = new Set(parseNoxiousStates(r['State Noxious Status'] ?? ''))
    // a federal noxious weed is listed for every US state
    if ((r['Federal Noxious Status'] ?? '').trim()) for (const s of usStates) regions.add(s)
    const key = nameKey(bare)
    noxious.set(key, new Set([...(noxious.get(key) ?? []), ...regions]))
  }

  // where each symbol is recorded, with the file's species-level status column (a fallback only)
  const recorded = new Map<string, Map<string, Set<string>>>()
  const unknownStates = new Set<string>()
  for (const d of readUsdaCsv(dataDir, 'plant_distribution')) {
    const code = regionCodeForStateName(d.state ?? '')
    if (!code) { unknownStates.add(d.state ?? ''); continue }
    let m = recorded.get(d.symbol!)
    if (!m) recorded.set(d.symbol!, (m = new Map()))
    let s = m.get(code)
    if (!s) m.set(code, (s = new Set()))
    s.add(d.status ?? '')
  }
  if (unknownStates.size) throw new Error(`distribution states without an ISO code: ${[...unknownStates].join(', ')}`)

  const entries: CatalogueEntry[] = []
  const seen = new Set<string>()
  let fallbackStatus = 0
  // taxa with characteristics first, so a duplicate bare name keeps the one with facts
  const ordered = [...plants].sort((a, b) => Number(characteristics.has(b.symbol!)) - Number(characteristics.has(a.symbol!)))
  for (const p of ordered) {
    const c = characteristics.get(p.symbol!) ?? null
    const name = bareName(p.scientific_name ?? '')
    const key = nameKey(name)
    const isSpecies = p.rank === 'Species' && name.split(' ').length === 2
    const regionsSeen = recorded.get(p.symbol!)
    // every taxon with characteristics; every other vascular species USDA records somewhere
    if (!c && (!isSpecies || NON_VASCULAR.has(p.group_name ?? '') || !regionsSeen)) continue
    if (seen.has(key)) continue
    seen.add(key)
    const facts = deriveFacts({ scientificName: name, family: p.family || null, genus: p.genus || null, growthHabit: p.growth_habit || null }, c)
    const areaStatus = nativeStatus.get(key) ?? null
    const noxiousIn = [...(noxious.get(key) ?? [])].sort()
    const regions: CatalogueEntry['regions'] = {}
    for (const [code, statuses] of [...(regionsSeen ?? new Map<string, Set<string>>())].sort(([a], [b]) => a.localeCompare(b))) {
      const distributionStatus = statuses.has('native') && statuses.has('introduced') ? 'both' : statuses.has('native') ? 'native' : 'introduced'
      const status = regionStatus({ region: code, recorded: true, areaStatus, distributionStatus, noxious: noxiousIn.includes(code) })
      if (status !== 'absent') regions[code] = status
    }
    if (!areaStatus && regionsSeen) fallbackStatus++
    const sources = { ...facts.sources, status: areaStatus ? USDA : `${USDA} (distribution file's species-level status: no native-status row)` }
    entries.push(withRangeHardiness({
      scientificName: name,
      usdaName: (p.scientific_name ?? '').replace(/\s+/g, ' ').trim() || null,
      commonName: p.common_name?.trim() || null,
      symbol: p.symbol!,
      family: p.family || null,
      genus: p.genus || null,
      growthHabit: p.growth_habit || null,
      duration: p.duration || null,
      ...facts,
      sources,
      noxiousIn,
      regions,
    }))
  }
  entries.sort((a, b) => a.scientificName.localeCompare(b.scientificName))
  return { entries, fallbackStatus }
}
