import { mysqlTable, varchar, json, decimal } from 'drizzle-orm/mysql-core'
import { id, timestamps } from './columns'

/** The organisation running Wildward: one row; its goal share applies to every yard's score. */
export const organisation = mysqlTable('organisation', {
  id: id(),
  name: varchar('name', { length: 160 }).notNull(),
  goal: decimal('goal', { precision: 4, scale: 3, mode: 'number' }).notNull().default(0.7),
  ...timestamps,
})

/** Markers for one-time work (demo data loaded, catalogue version), claimed by a unique key across instances. */
export const appMeta = mysqlTable('app_meta', {
  key: varchar('key', { length: 64 }).primaryKey(),
  value: json('value'),
  ...timestamps,
})
