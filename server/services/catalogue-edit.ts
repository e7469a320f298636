// A coordinator's change to one species from the form: the fields that differ from the catalogue become
// overrides (the same rows a CSV import writes), applied in one transaction.
import { SPECIES_EDIT_FIELDS, type OverrideField, type SpeciesEditBody } from '#shared/schemas/species'
import { applyOverrides, currentValue, regionStatuses, sameValue, useCatalogue, type OverrideRow } from './catalogue'
import { nameKey } from '#shared/utils/species-name'

/** The changed fields, or null when the species is not in the catalogue. */
export async function editSpecies(name: string, body: SpeciesEditBody, userId: number): Promise<{ scientificName: string; changed: OverrideField[] } | null> {
  const cat = await useCatalogue()
  const s = cat.byKey.get(nameKey(name.replace(/[_+]/g, ' ')))
  if (!s) return null
  const scientificName = s.data.scientificName
  const overrides: OverrideRow[] = []
  for (const field of SPECIES_EDIT_FIELDS) {
    const to = body[field]
    if (to === undefined || sameValue(currentValue(s.data, field), to)) continue
    overrides.push({ scientificName, region: '', field, value: to, source: body.source })
  }
  if (body.status && body.region) {
    const from = (await regionStatuses(cat, body.region)).get(s.id) ?? 'absent'
    if (from !== body.status) overrides.push({ scientificName, region: body.region, field: 'status', value: body.status, source: body.source })
  }
  if (overrides.length) await applyOverrides(overrides, userId)
  return { scientificName, changed: overrides.map((o) => o.field as OverrideField) }
}
