// What the printable certificate of a verified yard shows, for anyone who may view the yard.
import { idParam } from '#shared/schemas/common'
import { certificate } from '../../../services/drives'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { yard } = await requireYardAccess(event, id, 'view')
  return certificate(yard)
})
