// Native species that fit a spot (region, zone, sun, soil, moisture, layer, size), ranked with reasons, in two
// groups: a known fit, and site needs not recorded; a yard id adds its bloom and layer gaps (needs view access).
import { fitsQuery } from '#shared/schemas/species'
import { findFits, yardContext } from '../services/catalogue'

export default defineEventHandler(async (event) => {
  const q = readQueryWith(event, fitsQuery)
  let region = q.region
  let zone = q.zone
  let yard = null
  if (q.yardId) {
    const { yard: row } = await requireYardAccess(event, q.yardId, 'view')
    region ??= row.region
    zone ??= row.zone ?? undefined
    const names = row.document.plantings.map((p) => p.species).filter((s): s is string => !!s)
    yard = await yardContext(names, region)
  }
  const fits = await findFits({ region: region!, zone, sun: q.sun, soil: q.soil, moisture: q.moisture, layer: q.layer, maxSpread: q.maxSpread }, yard, q.limit, q.page)
  return { ...fits, page: q.page ?? 1, region, zone: zone ?? null }
})
