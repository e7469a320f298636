// The signed-in user's yards: owned, and shared with them.
import { listYardsFor } from '../../services/yards'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  return { items: await listYardsFor(user) }
})
