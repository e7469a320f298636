import { bigint, timestamp } from 'drizzle-orm/mysql-core'

// MariaDB rejects drizzle's serial(): an unsigned auto-increment bigint instead.
export const id = () => bigint('id', { mode: 'number', unsigned: true }).autoincrement().primaryKey()

/** A foreign key column to an `id()` column. */
export const ref = (name: string) => bigint(name, { mode: 'number', unsigned: true })

export const timestamps = {
  createdAt: timestamp('created_at', { fsp: 3 }).notNull().defaultNow(),
  updatedAt: timestamp('updated_at', { fsp: 3 }).notNull().defaultNow().onUpdateNow(),
}
