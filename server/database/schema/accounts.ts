import { mysqlTable, varchar, mysqlEnum, timestamp, char, index, uniqueIndex } from 'drizzle-orm/mysql-core'
import { id, ref, timestamps } from './columns'

import { ROLE_NAMES } from '../../../shared/types/roles'

export const ROLES = ROLE_NAMES

export const users = mysqlTable('users', {
  id: id(),
  email: varchar('email', { length: 254 }).notNull(),
  name: varchar('name', { length: 120 }).notNull(),
  passwordHash: varchar('password_hash', { length: 255 }).notNull(),
  role: mysqlEnum('role', ROLES).notNull().default('homeowner'),
  ...timestamps,
}, (t) => [uniqueIndex('users_email_unique').on(t.email)])

export const passwordResetTokens = mysqlTable('password_reset_tokens', {
  id: id(),
  userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  // sha-256 of the token sent by e-mail; the token itself is never stored
  tokenHash: char('token_hash', { length: 64 }).notNull(),
  expiresAt: timestamp('expires_at', { fsp: 3 }).notNull(),
  usedAt: timestamp('used_at', { fsp: 3 }),
  ...timestamps,
}, (t) => [uniqueIndex('password_reset_tokens_hash_unique').on(t.tokenHash), index('password_reset_tokens_user_idx').on(t.userId)])

/** Failed sign-ins, counted per e-mail and per address over a window (in the database: several app instances). */
export const loginFailures = mysqlTable('login_failures', {
  id: id(),
  email: varchar('email', { length: 254 }).notNull(),
  address: varchar('address', { length: 64 }).notNull(),
  at: timestamp('at', { fsp: 3 }).notNull().defaultNow(),
}, (t) => [index('login_failures_email_idx').on(t.email, t.at), index('login_failures_address_idx').on(t.address, t.at)])

/** An account as stored (the type every service and access helper takes). */
export type AccountRow = typeof users.$inferSelect
