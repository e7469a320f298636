// Coordinators: which seed reminders were sent (or are waiting, failed, cancelled), to whom, for which yard.
import { reminderLog } from '../../services/seed-reminders'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'coordinator')
  return reminderLog()
})
