import { mysqlTable, varchar, mysqlEnum, timestamp, char, index, uniqueIndex, int } from 'drizzle-orm/mysql-core'
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

/**
 * Signed-in sessions, so that they can end on the server: the sealed cookie carries a random token, this table
 * its sha-256. Sign-out deletes the row; a password change or reset deletes the account's other rows.
 */
export const sessions = mysqlTable('sessions', {
  tokenHash: char('token_hash', { length: 64 }).primaryKey(),
  userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  createdAt: timestamp('created_at', { fsp: 3 }).notNull().defaultNow(),
  lastSeenAt: timestamp('last_seen_at', { fsp: 3 }).notNull().defaultNow(),
}, (t) => [index('sessions_user_idx').on(t.userId)])

/**
 * Sign-in attempts per window, counted atomically (INSERT … ON DUPLICATE KEY UPDATE on one row): one row per
 * e-mail and address pair, one per address. The key is a sha-256 so e-mails are not kept here.
 */
export const loginAttempts = mysqlTable('login_attempts', {
  keyHash: char('key_hash', { length: 64 }).primaryKey(),
  attempts: int('attempts').notNull(),
  windowStart: timestamp('window_start', { fsp: 3 }).notNull().defaultNow(),
})

/** An account as stored (the type every service and access helper takes). */
export type AccountRow = typeof users.$inferSelect
