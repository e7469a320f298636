// A new private calendar address for the signed-in user's seed tasks; the previous one stops working.
import { newCalendarToken, calendarFeedPath, calendarStatus } from '../services/seed-reminders'

export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const token = await newCalendarToken(user.id)
  setResponseStatus(event, 201)
  return { url: appLink(calendarFeedPath(token)), ...(await calendarStatus(user.id)) }
})
