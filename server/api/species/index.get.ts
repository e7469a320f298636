// The species table and search-as-you-type: filter, sort and page the catalogue, with each species' status in a region.
import { speciesListQuery } from '#shared/schemas/species'
import { listSpecies } from '../../services/catalogue'

export default defineEventHandler(async (event) => {
  const query = readQueryWith(event, speciesListQuery)
  return listSpecies(query)
})
