// Liveness and readiness: 200 when the database answers, 503 with the reason when it does not.
import { sql } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  try {
    await startupReady()
    await useDb().execute(sql`select 1`)
    return { status: 'ok', database: 'ok' }
  } catch (e) {
    setResponseStatus(event, 503)
    return { status: 'unavailable', database: 'unreachable', message: `The database is not reachable: ${(e as Error).message}` }
  }
})
