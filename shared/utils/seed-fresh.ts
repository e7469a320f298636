/**
 * Seed that must be sown fresh: it dies if it dries out (recalcitrant seed), so it is sown in fall as soon as it is
 * collected and never stored dry to spring. USDA PLANTS has no field for this; the default list below is from
 * memory of the USDA Forest Service Woody Plant Seed Manual (Agriculture Handbook 727, 2008) genus chapters and
 * common nursery practice, and a coordinator corrects it per species (the catalogue's `sowFresh` field).
 */
import { nameKey } from './species-name'

export const SOW_FRESH_SOURCE = 'from memory: seed that dies when dried (default list)'

/** Genera whose seed is recalcitrant: oaks (acorns of the white-oak group sprout in fall), buckeyes, chestnuts, pawpaw. */
export const SOW_FRESH_GENERA = new Set(['quercus', 'aesculus', 'castanea', 'asimina'])
/** Single species outside those genera, lower-case binomials. */
export const SOW_FRESH_SPECIES = new Set(['lindera benzoin'])

export function defaultSowFresh(scientificName: string, genus?: string | null): boolean {
  const name = nameKey(scientificName)
  const g = (genus ?? name.split(' ')[0] ?? '').toLowerCase()
  return SOW_FRESH_GENERA.has(g) || SOW_FRESH_SPECIES.has(name.split(' ').slice(0, 2).join(' '))
}

/** The catalogue's flag where set (by a coordinator), else the default list; with where the answer came from. */
export function sowFreshOf(d: { scientificName: string; genus?: string | null; sowFresh?: boolean | null; sources?: Record<string, string> }): { value: boolean; source: string } {
  if (d.sowFresh === true || d.sowFresh === false) return { value: d.sowFresh, source: d.sources?.sowFresh ?? 'coordinator' }
  return { value: defaultSowFresh(d.scientificName, d.genus), source: SOW_FRESH_SOURCE }
}
