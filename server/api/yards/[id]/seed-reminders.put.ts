// Turn the signed-in user's seed-task reminders for this yard on or off.
import { idParam } from '#shared/schemas/common'
import { seedReminderBody } from '#shared/schemas/seed'
import { setSeedReminders } from '../../../services/seed-reminders'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, seedReminderBody)
  const { user, yard } = await requireYardAccess(event, id, 'view')
  return setSeedReminders(user, yard, body.enabled, body.leadDays)
})
