// The coordinator's queue of advice requests, or an advisor's own assignments.
import { adviceQueueQuery } from '#shared/schemas/advice'
import { listRequests } from '../../services/advice'

export default defineEventHandler(async (event) => {
  const { status } = readQueryWith(event, adviceQueueQuery)
  const user = await requireRole(event, 'coordinator', 'advisor')
  return { items: await listRequests(user, status) }
})
