// Whether the signed-in user gets e-mail reminders for this yard's seed tasks, and which are scheduled.
import { idParam } from '#shared/schemas/common'
import { subscriptionFor, reminderStatus } from '../../../services/seed-reminders'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { user, yard } = await requireYardAccess(event, id, 'view')
  return reminderStatus(await subscriptionFor(user.id, yard.id))
})
