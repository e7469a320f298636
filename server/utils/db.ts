import mysql from 'mysql2/promise'
import { drizzle, type MySql2Database } from 'drizzle-orm/mysql2'
import * as schema from '../database/schema'

export { schema }
export type Db = MySql2Database<typeof schema>

let db: Db | undefined

/** The Drizzle client over one mysql2 pool per app instance (many instances may share one MariaDB). */
export function useDb(): Db {
  if (!db) {
    const url = useRuntimeConfig().databaseUrl
    if (!url) throw createError({ status: 503, message: 'The database is not configured (NUXT_DATABASE_URL)' })
    const pool = mysql.createPool({ uri: url, connectionLimit: 20, waitForConnections: true, timezone: 'Z', dateStrings: false })
    db = drizzle(pool, { schema, mode: 'default' })
  }
  return db
}

/** The id from `$returningId()` of a single-row insert (MariaDB has no RETURNING in Drizzle). */
export function insertedId(rows: { id: number }[]): number {
  const id = rows[0]?.id
  if (id === undefined) throw new Error('insert returned no id')
  return id
}

/** `term` with LIKE's own wildcards (% _) and escape (\) taken literally. */
export function escapeLike(term: string): string {
  return term.replace(/[\\%_]/g, (c) => `\\${c}`)
}

/** A LIKE pattern matching `term` anywhere. */
export function containsPattern(term: string): string {
  return `%${escapeLike(term)}%`
}
