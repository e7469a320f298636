// The yard's grow-from-seed plan for the coming season: species, pots, seed, treatments, dates, tasks, totals.
import { idParam } from '#shared/schemas/common'
import { seedPlanQuery } from '#shared/schemas/seed'
import { seedPlanFor } from '../../../services/seed-plan'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const query = readQueryWith(event, seedPlanQuery)
  const { yard, access } = await requireYardAccess(event, id, 'view')
  return { ...(await seedPlanFor(yard, query.today)), access }
})
