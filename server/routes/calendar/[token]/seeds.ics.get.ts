// A user's private calendar feed of seed tasks across their yards: the secret token in the URL, no session.
import { z } from 'zod'
import { userForCalendarToken } from '../../../services/seed-reminders'
import { seedPlanFor, taskEvents, calendarText } from '../../../services/seed-plan'
import { listYardsFor } from '../../../services/yards'
import { yardAccessLevel } from '../../../services/yard-access'
import { yards } from '../../../database/schema'
import { inArray } from 'drizzle-orm'

const params = z.object({ token: z.string().regex(/^[A-Za-z0-9_-]{43}$/) })

export default defineEventHandler(async (event) => {
  const { token } = readParamsWith(event, params)
  const user = await userForCalendarToken(token)
  // a revoked or unknown address is simply not found
  if (!user) throw createError({ status: 404, message: 'No such calendar' })
  const listed = await listYardsFor(user)
  const rows = listed.length ? await useDb().select().from(yards).where(inArray(yards.id, listed.map((y) => y.id))) : []
  const plans = []
  for (const yard of rows) {
    if (await yardAccessLevel(user, yard)) plans.push(await seedPlanFor(yard))
  }
  setHeader(event, 'content-type', 'text/calendar; charset=utf-8')
  setHeader(event, 'cache-control', 'private, max-age=900')
  return calendarText(taskEvents(plans, (yardId) => appLink(`/yards/${yardId}/seeds`)), 'Wildward: grow from seed')
})
