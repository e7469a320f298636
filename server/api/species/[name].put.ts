// A coordinator corrects one species (facts, or its status in a region on the organization's list) from a form.
import { speciesEditBody, speciesNameParam } from '#shared/schemas/species'
import { editSpecies } from '../../services/catalogue-edit'

export default defineEventHandler(async (event) => {
  const { name } = readParamsWith(event, speciesNameParam)
  const user = await requireRole(event, 'coordinator')
  const body = await readBodyWith(event, speciesEditBody)
  const result = await editSpecies(name, body, user.id)
  if (!result) throw createError({ status: 404, message: `${name} is not in the catalogue` })
  return result
})
