import { mysqlTable, varchar, mysqlEnum, json, int, char, index, uniqueIndex } from 'drizzle-orm/mysql-core'
import { id, ref, timestamps } from './columns'
import { users } from './accounts'
import type { YardDocument } from '../../../shared/schemas/yard-document'

export const yards = mysqlTable('yards', {
  id: id(),
  ownerId: ref('owner_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  name: varchar('name', { length: 120 }).notNull(),
  // ISO 3166-2 code of the state or province, e.g. US-OH, CA-ON
  region: varchar('region', { length: 6 }).notNull(),
  zone: varchar('zone', { length: 3 }),
  // MM-DD
  lastSpringFrost: char('last_spring_frost', { length: 5 }),
  firstFallFrost: char('first_fall_frost', { length: 5 }),
  units: mysqlEnum('units', ['ft', 'm']).notNull().default('ft'),
  document: json('document').$type<YardDocument>().notNull(),
  // optimistic concurrency: every save names the version it edited and bumps it
  version: int('version', { unsigned: true }).notNull().default(1),
  ...timestamps,
}, (t) => [index('yards_owner_idx').on(t.ownerId)])

export const YARD_MEMBER_ROLES = ['viewer', 'editor'] as const

export const yardMembers = mysqlTable('yard_members', {
  id: id(),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  role: mysqlEnum('role', YARD_MEMBER_ROLES).notNull(),
  ...timestamps,
}, (t) => [uniqueIndex('yard_members_yard_user_unique').on(t.yardId, t.userId), index('yard_members_user_idx').on(t.userId)])

/** A yard as stored. */
export type YardRow = typeof yards.$inferSelect
