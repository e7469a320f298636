// One species: its facts with the source of each, where it grows and its status there, coordinator overrides.
import { speciesNameParam, speciesDetailQuery } from '#shared/schemas/species'
import { speciesPage } from '../../services/catalogue'

export default defineEventHandler(async (event) => {
  const { name } = readParamsWith(event, speciesNameParam)
  const { region } = readQueryWith(event, speciesDetailQuery)
  const page = await speciesPage(name, region)
  if (!page) throw createError({ status: 404, message: `${name} is not in the catalogue` })
  return page
})
