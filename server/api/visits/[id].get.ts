// A site visit with notes, photos, pins and recommendations (its advisor, or anyone who may view the yard).
import { idParam } from '#shared/schemas/common'
import { visitDetails } from '../../services/advice'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const user = await requireUser(event)
  return visitDetails(user, id)
})
