// Liveness and readiness: 200 when the database answers, 503 (with Retry-After, and never the failed query) when not.
import { sql } from 'drizzle-orm'

export default defineEventHandler(async (event) => {
  try {
    await startupReady()
    await useDb().execute(sql`select 1`)
    return { status: 'ok', database: 'ok' }
  } catch {
    setResponseStatus(event, 503)
    setResponseHeader(event, 'retry-after', DATABASE_RETRY_AFTER_S)
    return { status: 'unavailable', database: 'unreachable', message: DATABASE_UNREACHABLE_MESSAGE }
  }
})
