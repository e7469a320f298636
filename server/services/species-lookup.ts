import type { SpeciesFacts } from '#shared/types/species'
import { speciesFactsFor } from './catalogue'

// The one place the score engine asks about species: answered from this instance's in-memory copy of the
// catalogue (refreshed when the catalogue stamp in app_meta changes), keyed by the lower-cased name as given.
export async function loadSpeciesFacts(names: Iterable<string>, region: string): Promise<Map<string, SpeciesFacts>> {
  return speciesFactsFor(names, region)
}
