// The visiting advisor confirms that the yard's pledge reached the goal (it becomes verified).
import { idParam } from '#shared/schemas/common'
import { requireVisit } from '../../../services/advice'
import { verifyPledge } from '../../../services/drives'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const user = await requireUser(event)
  const { visit } = await requireVisit(user, id, 'edit')
  return verifyPledge(user, visit.yardId)
})
