// Volunteer advisors with their open assignments, for the coordinator's assignment menu.
import { listAdvisors } from '../../services/advice'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'coordinator')
  return { items: await listAdvisors() }
})
