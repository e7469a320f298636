// Revoke the signed-in user's private calendar address.
import { revokeCalendarTokens, calendarStatus } from '../services/seed-reminders'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  await revokeCalendarTokens(user.id)
  return calendarStatus(user.id)
})
