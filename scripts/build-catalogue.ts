// `npm run catalogue:build [-- <usda-plants dir> [<output dir>]]`: derives Wildward's species catalogue from the
// USDA PLANTS exports and writes it, gzipped, into server/assets/catalogue/ with its provenance beside it.
// Every mapping rule lives in shared/utils/catalogue-rules.ts; the reading and joining in scripts/lib/catalogue-build.ts.
import { writeFileSync, mkdirSync } from 'node:fs'
import { gzipSync } from 'node:zlib'
import { createHash } from 'node:crypto'
import { join, resolve } from 'node:path'
import { buildCatalogueEntries, CATALOGUE_FORMAT } from './lib/catalogue-build'

const ROOT = resolve(import.meta.dirname, '..')
const dataDir = resolve(process.argv[2] ?? process.env.WW_USDA_DIR ?? join(ROOT, '..', 'shared', 'data', 'usda-plants'))
const outDir = resolve(process.argv[3] ?? join(ROOT, 'server', 'assets', 'catalogue'))

const { entries, fallbackStatus } = buildCatalogueEntries(dataDir)
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
