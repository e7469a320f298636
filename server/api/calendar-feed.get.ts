// Whether the signed-in user has a private calendar address for their seed tasks (the secret is never shown again).
import { calendarStatus } from '../services/seed-reminders'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  return calendarStatus(user.id)
})
