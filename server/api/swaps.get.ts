// Native swaps for an introduced or invasive species: same layer, similar size, fit for the same spot.
import { swapsQuery } from '#shared/schemas/species'
import { findSwaps } from '../services/catalogue'

export default defineEventHandler(async (event) => {
  const q = readQueryWith(event, swapsQuery)
  const result = await findSwaps(q.species, { region: q.region, zone: q.zone, sun: q.sun, soil: q.soil, moisture: q.moisture }, q.limit)
  if (!result) throw createError({ status: 404, message: `${q.species} is not in the catalogue`, data: { fields: { species: 'Not in the catalogue' } } })
  return result
})
