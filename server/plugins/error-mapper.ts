// The one place a failure becomes an answer: an unreachable database is a 503 with Retry-After and a plain
// message (never a query's text), a lost unique-key race a 409, lock contention a 503 to retry, a value a column
// refuses a 400 naming it. Other errors keep their own status. Runs before Nitro/Nuxt render the error.

type MappedError = Error & { statusCode?: number; statusMessage?: string; unhandled?: boolean; fatal?: boolean; data?: unknown }

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('error', (error, { event }) => {
    const e = error as MappedError
    if (!event || (e.statusCode && e.statusCode < 500)) return
    const set = (status: number, message: string, data?: unknown) => {
      e.statusCode = status
      e.statusMessage = status === 503 ? 'Service Unavailable' : status === 409 ? 'Conflict' : 'Bad Request'
      e.message = message
      e.unhandled = false
      e.fatal = false
      e.data = data
    }
    if (isDatabaseUnreachable(e)) {
      set(503, DATABASE_UNREACHABLE_MESSAGE)
      setResponseHeader(event, 'retry-after', DATABASE_RETRY_AFTER_S)
    } else if (isRetryableContention(e)) {
      set(503, 'The server is busy; try again')
      setResponseHeader(event, 'retry-after', 1)
    } else if (e.statusCode === 503) {
      // any other 503 (the score workers are all busy) says when to come back too
      setResponseHeader(event, 'retry-after', 2)
    } else if (isDuplicateKey(e)) {
      set(409, 'That already exists (someone else just saved it); reload and try again')
    } else {
      const column = rejectedColumn(e)
      if (column) set(400, `A value is too long or not valid for ${column}`, { fields: { [column]: 'Too long or not valid' } })
    }
  })
})
