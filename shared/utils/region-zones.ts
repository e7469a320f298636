// Each state's and province's coldest USDA hardiness zone, for estimating a native's cold hardiness where USDA
// PLANTS gives no minimum temperature: a species survives, at the least, the coldest winters where it is native.
// Values: the coldest half-zone shown for each state on the USDA 2023 Plant Hardiness Zone Map (US states and
// territories) and on USDA-equivalent maps of Canada (its provinces in USDA zones, not Canada's own index),
// recalled rather than read off the map: "from memory". Mountains make a few states' coldest zone much colder
// than where people live; the estimate is labelled as one wherever it is shown.
import { zoneIndex, zoneName, type CatalogueEntry } from './catalogue-rules'
import { REGIONS } from './regions'

export const REGION_ZONES_SOURCE = 'USDA 2023 Plant Hardiness Zone Map, coldest zone in each state or province (from memory)'

export const COLDEST_ZONE: Record<string, string> = {
  'US-AL': '7a', 'US-AK': '1a', 'US-AZ': '4b', 'US-AR': '6b', 'US-CA': '4b', 'US-CO': '3b', 'US-CT': '6a', 'US-DE': '7a',
  'US-DC': '7b', 'US-FL': '8a', 'US-GA': '7a', 'US-HI': '9a', 'US-ID': '3b', 'US-IL': '5b', 'US-IN': '5b', 'US-IA': '4b',
  'US-KS': '5b', 'US-KY': '6a', 'US-LA': '8a', 'US-ME': '3b', 'US-MD': '6a', 'US-MA': '5b', 'US-MI': '4a', 'US-MN': '3a',
  'US-MS': '7b', 'US-MO': '6a', 'US-MT': '3a', 'US-NE': '4b', 'US-NV': '4b', 'US-NH': '4a', 'US-NJ': '6a', 'US-NM': '4b',
  'US-NY': '4a', 'US-NC': '6a', 'US-ND': '3a', 'US-OH': '5b', 'US-OK': '6b', 'US-OR': '4b', 'US-PA': '5b', 'US-RI': '6b',
  'US-SC': '7b', 'US-SD': '3b', 'US-TN': '6a', 'US-TX': '6b', 'US-UT': '4a', 'US-VT': '3b', 'US-VA': '6a', 'US-WA': '4a',
  'US-WV': '5b', 'US-WI': '3b', 'US-WY': '3a', 'US-PR': '11a', 'US-VI': '12a', 'US-GU': '13a', 'US-AS': '13a',
  'US-MP': '13a', 'US-UM': '12a', 'US-PW': '13a', 'US-MH': '13a', 'US-FM': '13a',
  'CA-AB': '2a', 'CA-BC': '1b', 'CA-MB': '1b', 'CA-NB': '3b', 'CA-NL': '1b', 'CA-NS': '4a', 'CA-NT': '1a', 'CA-NU': '1a',
  'CA-ON': '1b', 'CA-PE': '4b', 'CA-QC': '1a', 'CA-SK': '2a', 'CA-YT': '1a',
}

/** The words every estimate from the range starts with (shown to people as the fact's source). */
export const RANGE_ESTIMATE = 'estimated from its native range'

export interface RangeHardiness { zone: string; region: string; source: string }

// provinces, territories and Alaska reach the Arctic, so a record there says little about how far north a species
// grows: they count only for a species native nowhere else
const REACHES_ARCTIC = (region: string) => region.startsWith('CA-') || region === 'US-AK'

/**
 * A species' coldest zone estimated from where it is native: the coldest zone of the coldest region among them,
 * with that region named for the label; null when it is native nowhere the table covers.
 */
export function hardinessFromRange(nativeRegions: Iterable<string>): RangeHardiness | null {
  const all = [...nativeRegions]
  const southern = all.filter((r) => !REACHES_ARCTIC(r) && COLDEST_ZONE[r])
  let best: { index: number; region: string } | null = null
  for (const region of southern.length ? southern : all) {
    const index = zoneIndex(COLDEST_ZONE[region])
    if (index !== null && (!best || index < best.index)) best = { index, region }
  }
  if (!best) return null
  const zone = zoneName(best.index)
  return { zone, region: best.region, source: `${RANGE_ESTIMATE}: native in ${REGIONS[best.region] ?? best.region}, whose coldest zone is ${zone} (state table, from memory)` }
}

/** A catalogue entry without USDA's minimum temperature gets its coldest zone from its native range, marked estimated. */
export function withRangeHardiness<T extends Pick<CatalogueEntry, 'minZone' | 'regions' | 'sources' | 'estimated'>>(entry: T): T {
  if (entry.minZone) return entry
  const native = Object.entries(entry.regions).filter(([, s]) => s === 'native' || s === 'nativeAndIntroduced').map(([r]) => r)
  const range = hardinessFromRange(native)
  if (!range) return entry
  entry.minZone = range.zone
  entry.sources.minZone = range.source
  if (!entry.estimated.includes('minZone')) entry.estimated.push('minZone')
  return entry
}
