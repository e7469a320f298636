// `npm run catalogue:build [-- <usda-plants dir> [<output dir>]]`: derives Wildward's species catalogue from the
// USDA PLANTS exports and writes it, gzipped, into server/assets/catalogue/ with its provenance beside it.
// Every mapping rule lives in shared/utils/catalogue-rules.ts; this file only reads, joins and writes.
import { readFileSync, writeFileSync, mkdirSync } from 'node:fs'
import { gunzipSync, gzipSync } from 'node:zlib'
import { createHash } from 'node:crypto'
import { join, resolve } from 'node:path'
import Papa from 'papaparse'
import {
  bareName, deriveFacts, parseNativeStatus, parseNoxiousStates, regionCodeForStateName, regionStatus, nameKey,
  USDA, type AreaStatus, type CatalogueEntry, type CharacteristicsRow,
} from '../shared/utils/catalogue-rules'

const ROOT = resolve(import.meta.dirname, '..')
const dataDir = resolve(process.argv[2] ?? process.env.WW_USDA_DIR ?? join(ROOT, '..', 'shared', 'data', 'usda-plants'))
const outDir = resolve(process.argv[3] ?? join(ROOT, 'server', 'assets', 'catalogue'))

export const CATALOGUE_FORMAT = 'wildward.catalogue/1'
const NON_VASCULAR = new Set(['Lichen', 'Moss', 'Liverwort', 'Hornwort', 'Green Algae', 'Red Algae', 'Brown Algae'])

function readCsv(file: string): Record<string, string>[] {
  const text = gunzipSync(readFileSync(join(dataDir, file))).toString('utf8')
  const parsed = Papa.parse<Record<string, string>>(text, { header: true, skipEmptyLines: true })
  if (parsed.errors.length) console.warn(`${file}: ${parsed.errors.length} parse warnings (first: ${parsed.errors[0]!.message})`)
  return parsed.data
}

const plants = readCsv('plants.csv.gz')
const characteristics = new Map(readCsv('plant_characteristics.csv.gz').map((r) => [r.symbol!, r as CharacteristicsRow]))
const distribution = readCsv('plant_distribution.csv.gz')
const nativeStatus = new Map<string, Record<string, AreaStatus>>()
for (const r of readCsv('plant_native_status_codes.csv.gz')) nativeStatus.set(nameKey(bareName(r.scientificName!)), parseNativeStatus(r.nativeStatus ?? ''))
const noxious = new Map<string, Set<string>>()
const usStates = Object.keys((await import('../shared/utils/regions')).REGIONS).filter((c) => c.startsWith('US-'))
for (const r of readCsv('noxious_composite_2015.csv.gz')) {
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
for (const d of distribution) {
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
  let usedFallback = false
  for (const [code, statuses] of [...(regionsSeen ?? new Map<string, Set<string>>())].sort(([a], [b]) => a.localeCompare(b))) {
    const distributionStatus = statuses.has('native') && statuses.has('introduced') ? 'both' : statuses.has('native') ? 'native' : 'introduced'
    const status = regionStatus({ region: code, recorded: true, areaStatus, distributionStatus, noxious: noxiousIn.includes(code) })
    if (!areaStatus) usedFallback = true
    if (status !== 'absent') regions[code] = status
  }
  if (usedFallback) fallbackStatus++
  const sources = { ...facts.sources, status: areaStatus ? USDA : `${USDA} (distribution file's species-level status: no native-status row)` }
  entries.push({
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
  })
}
entries.sort((a, b) => a.scientificName.localeCompare(b.scientificName))

const body = JSON.stringify(entries)
const version = `usda-${createHash('sha256').update(body).digest('hex').slice(0, 12)}`
const regionsCovered = [...new Set(entries.flatMap((e) => Object.keys(e.regions)))].sort()
const header = {
  format: CATALOGUE_FORMAT,
  version,
  source: 'USDA NRCS PLANTS Database (public domain), exports described in ../shared/data/usda-plants/README.md; noxious list: USDA composite of state lists, January 2015',
  rules: 'shared/utils/catalogue-rules.ts',
  counts: { species: entries.length, withCharacteristics: entries.filter((e) => e.hasCharacteristics).length, statusRows: entries.reduce((n, e) => n + Object.keys(e.regions).length, 0), regions: regionsCovered.length },
}
mkdirSync(outDir, { recursive: true })
const file = join(outDir, 'catalogue.json.gz')
const gz = gzipSync(`{"header":${JSON.stringify(header)},"species":${body}}`, { level: 9 })
writeFileSync(file, gz)
writeFileSync(join(outDir, 'PROVENANCE.md'), `# Species catalogue (generated: do not edit by hand)

\`catalogue.json.gz\` is derived by \`npm run catalogue:build\` (scripts/build-catalogue.ts) from the USDA NRCS
PLANTS Database exports in \`../shared/data/usda-plants/\` (public domain, a US-government work):
plants.csv.gz, plant_characteristics.csv.gz, plant_distribution.csv.gz, plant_native_status_codes.csv.gz and
noxious_composite_2015.csv.gz (state noxious lists as of January 2015). Only the format changed, and the mapping
rules in \`shared/utils/catalogue-rules.ts\` (documented there) turn traits into Wildward's facts. Values USDA
lacks (spread, spacing, cold-moist days, seed light, scarification, seedlings per pot) are defaults marked
\`estimated\`, each with its rule in \`sources\`.

USDA gives native status for the lower 48 states as a whole (and for Canada as a whole): "native in US-OH" means
"native to the lower 48 and recorded in Ohio".

- version: ${version}
- format: ${CATALOGUE_FORMAT}
- taxa: ${header.counts.species} (${header.counts.withCharacteristics} with a characteristics row)
- region status rows: ${header.counts.statusRows} over ${header.counts.regions} regions (ISO 3166-2 codes)
- species whose status fell back to the distribution file's status column: ${fallbackStatus}
- size: ${(gz.length / 1024 / 1024).toFixed(2)} MB gzipped
`)
console.log(`wrote ${file}: ${version}, ${entries.length} taxa, ${header.counts.statusRows} status rows, ${(gz.length / 1024 / 1024).toFixed(2)} MB`)
