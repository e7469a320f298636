// The seed plan's tasks as an .ics calendar file to download.
import { idParam } from '#shared/schemas/common'
import { seedPlanQuery } from '#shared/schemas/seed'
import { seedPlanFor, taskEvents, calendarText } from '../../../services/seed-plan'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const query = readQueryWith(event, seedPlanQuery)
  const { yard } = await requireYardAccess(event, id, 'view')
  const plan = await seedPlanFor(yard, query.today)
  const text = calendarText(taskEvents([plan], (yardId) => appLink(`/yards/${yardId}/seeds`)), `${yard.name}: grow from seed`)
  setHeader(event, 'content-type', 'text/calendar; charset=utf-8')
  setHeader(event, 'content-disposition', `attachment; filename="seed-plan-yard-${yard.id}.ics"`)
  return text
})
