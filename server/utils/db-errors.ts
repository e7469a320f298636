// What a database error means for the person who sent the request. Used by the one error mapper
// (server/plugins/error-mapper.ts) and by code that must tell an outage from a bug.

export const DATABASE_RETRY_AFTER_S = 5
export const DATABASE_UNREACHABLE_MESSAGE = 'The database is not reachable; try again shortly'

/** MariaDB/mysql2 error codes that mean the server cannot be reached or dropped the connection. */
const UNREACHABLE = new Set([
  'ECONNREFUSED', 'ECONNRESET', 'ETIMEDOUT', 'EPIPE', 'ENOTFOUND', 'EHOSTUNREACH', 'PROTOCOL_CONNECTION_LOST',
  'PROTOCOL_SEQUENCE_TIMEOUT', 'ER_CON_COUNT_ERROR', 'ER_SERVER_SHUTDOWN', 'ER_CONNECTION_KILLED', 'ER_QUERY_INTERRUPTED',
  'PROTOCOL_ENQUEUE_AFTER_FATAL_ERROR', 'ER_SERVER_GONE_ERROR', 'ER_SERVER_LOST', 'CR_CONN_HOST_ERROR',
])
/** Transient contention: the request may simply be sent again. */
const RETRY = new Set(['ER_LOCK_DEADLOCK', 'ER_LOCK_WAIT_TIMEOUT'])

interface DbError { code?: string; errno?: number; fatal?: boolean; message?: string; sqlMessage?: string }

/** The mysql2 error inside whatever wrapped it (h3's createError, drizzle's DrizzleQueryError), if any. */
export function databaseError(e: unknown): DbError | undefined {
  for (let cur = e as (DbError & { cause?: unknown }) | undefined, depth = 0; cur && depth < 6; cur = cur.cause as typeof cur, depth++) {
    if (typeof cur === 'object' && (typeof cur.code === 'string' || typeof cur.errno === 'number') && ('sqlMessage' in cur || 'fatal' in cur || 'errno' in cur)) return cur
    if (typeof cur === 'object' && typeof cur.code === 'string' && UNREACHABLE.has(cur.code)) return cur
  }
  return undefined
}

export function isDatabaseUnreachable(e: unknown): boolean {
  const err = databaseError(e)
  return !!err && (UNREACHABLE.has(err.code ?? '') || err.fatal === true || /pool is closed|connection.*closed/i.test(err.message ?? ''))
}

export function isRetryableContention(e: unknown): boolean {
  return RETRY.has(databaseError(e)?.code ?? '')
}

export function isDuplicateKey(e: unknown): boolean {
  return databaseError(e)?.code === 'ER_DUP_ENTRY'
}

/** The column a "too long" / "incorrect value" error names (MariaDB puts it in quotes), or undefined. */
export function rejectedColumn(e: unknown): string | undefined {
  const err = databaseError(e)
  if (!err || !['ER_DATA_TOO_LONG', 'ER_TRUNCATED_WRONG_VALUE', 'ER_TRUNCATED_WRONG_VALUE_FOR_FIELD', 'ER_CONSTRAINT_FAILED', 'ER_WRONG_VALUE_FOR_TYPE', 'ER_INVALID_JSON_TEXT', 'ER_NET_PACKET_TOO_LARGE', 'ER_WARN_DATA_OUT_OF_RANGE'].includes(err.code ?? '')) return undefined
  return /column [`']([^`']+)[`']/i.exec(err.sqlMessage ?? '')?.[1] ?? /CONSTRAINT [`']([^`']+)[`']/i.exec(err.sqlMessage ?? '')?.[1] ?? '_'
}

/** Retries `work` when the database chose it as a deadlock victim or a lock wait timed out (a few times). */
export async function withContentionRetry<T>(work: () => Promise<T>, attempts = 4): Promise<T> {
  for (let i = 1; ; i++) {
    try {
      return await work()
    } catch (e) {
      if (i >= attempts || !isRetryableContention(e)) throw e
      await new Promise((r) => setTimeout(r, 10 * i + Math.random() * 20))
    }
  }
}
