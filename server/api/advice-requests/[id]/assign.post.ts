// Assign (or reassign) an advisor to a request (coordinators); the advisor is mailed.
import { idParam } from '#shared/schemas/common'
import { assignBody } from '#shared/schemas/advice'
import { assignAdvisor } from '../../../services/advice'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { advisorId } = await readBodyWith(event, assignBody)
  const user = await requireRole(event, 'coordinator')
  return assignAdvisor(user, id, advisorId)
})
