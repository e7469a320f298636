// Save the seed plan's margin and per-species choices (grow or not, seedlings per pot); stale version → 409.
import { idParam } from '#shared/schemas/common'
import { updateSeedPlanBody } from '#shared/schemas/seed'
import { saveSeedSettings, seedPlanFor } from '../../../services/seed-plan'
import { syncYardReminders } from '../../../services/seed-reminders'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, updateSeedPlanBody)
  const { yard, access } = await requireYardAccess(event, id, 'edit')
  await saveSeedSettings(yard, body)
  await syncYardReminders(yard)
  return { ...(await seedPlanFor(yard)), access }
})
