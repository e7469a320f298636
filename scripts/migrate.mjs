// Applies the Drizzle migrations in drizzle/ with drizzle-orm's migrator, so a failing statement's SQL error
// is printed (drizzle-kit migrate exits 1 without saying why).
import mysql from 'mysql2/promise'
import { drizzle } from 'drizzle-orm/mysql2'
import { migrate } from 'drizzle-orm/mysql2/migrator'

const url = process.env.DATABASE_URL
if (!url) {
  console.error('DATABASE_URL is not set')
  process.exit(1)
}
const connection = await mysql.createConnection({ uri: url, multipleStatements: false })
try {
  await migrate(drizzle(connection), { migrationsFolder: new URL('../drizzle', import.meta.url).pathname })
} catch (e) {
  console.error('migration failed:', e.cause?.sqlMessage ?? e.message)
  if (e.cause?.sql) console.error(e.cause.sql)
  process.exit(1)
} finally {
  await connection.end()
}
