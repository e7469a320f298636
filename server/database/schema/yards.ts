import { mysqlTable, varchar, mysqlEnum, json, int, char, date, double, index, uniqueIndex } from 'drizzle-orm/mysql-core'
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

export const WORK_ACTIONS = ['planted', 'removed'] as const

/**
 * A yard's native shares recorded each time work is marked done (planted or removed), on the date the work was
 * done: the yard's history. Shares now (what a pledge is judged on) and with the plan; null when nothing to share.
 */
export const yardShareHistory = mysqlTable('yard_share_history', {
  id: id(),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  day: date('day', { mode: 'string' }).notNull(),
  action: mysqlEnum('action', WORK_ACTIONS).notNull(),
  // how many plantings and areas the work covered
  items: int('items', { unsigned: true }).notNull(),
  countShare: double('count_share'),
  areaShare: double('area_share'),
  volumeShare: double('volume_share'),
  plannedCountShare: double('planned_count_share'),
  plannedAreaShare: double('planned_area_share'),
  plannedVolumeShare: double('planned_volume_share'),
  // native cover the work added and lawn it took out, m² (the drive's "native cover added" and "lawn converted")
  nativeAreaAdded: double('native_area_added').notNull().default(0),
  lawnRemoved: double('lawn_removed').notNull().default(0),
  ...timestamps,
}, (t) => [index('yard_share_history_yard_day_idx').on(t.yardId, t.day, t.id)])

/** A yard as stored. */
export type YardRow = typeof yards.$inferSelect
