import { mysqlTable, varchar, json, int, decimal, boolean, timestamp, char, index, uniqueIndex } from 'drizzle-orm/mysql-core'
import { id, ref, timestamps } from './columns'
import { users } from './accounts'
import { yards } from './yards'
import type { SpeciesSetting } from '../../../shared/utils/seed-plan'

// Grow from seed: each yard's seed-plan choices, reminder opt-ins, private calendar feeds, seed prices.

/** A yard's seed-plan edits; no row means every default (20 % margin, species propagated by seed). */
export const seedPlans = mysqlTable('seed_plans', {
  id: id(),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  margin: decimal('margin', { precision: 4, scale: 3, mode: 'number' }).notNull().default(0.2),
  // by lower-case scientific name: grow toggle and seedlings-per-pot override
  species: json('species').$type<Record<string, SpeciesSetting>>().notNull(),
  version: int('version', { unsigned: true }).notNull().default(1),
  ...timestamps,
}, (t) => [uniqueIndex('seed_plans_yard_unique').on(t.yardId)])

/** E-mail reminders before each task, per user and yard; the token in every mail's unsubscribe link. */
export const seedReminderSubscriptions = mysqlTable('seed_reminder_subscriptions', {
  id: id(),
  userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  enabled: boolean('enabled').notNull().default(true),
  // can only stop these reminders, so it is kept as is to be put in each mail
  unsubscribeToken: varchar('unsubscribe_token', { length: 64 }).notNull(),
  leadDays: int('lead_days', { unsigned: true }).notNull().default(3),
  ...timestamps,
}, (t) => [
  uniqueIndex('seed_reminder_subscriptions_user_yard_unique').on(t.userId, t.yardId),
  uniqueIndex('seed_reminder_subscriptions_token_unique').on(t.unsubscribeToken),
  index('seed_reminder_subscriptions_yard_idx').on(t.yardId),
])

/** A user's private calendar address; only the sha-256 of the secret is stored, and revoking keeps the row. */
export const calendarTokens = mysqlTable('calendar_tokens', {
  id: id(),
  userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  tokenHash: char('token_hash', { length: 64 }).notNull(),
  revokedAt: timestamp('revoked_at', { fsp: 3 }),
  lastUsedAt: timestamp('last_used_at', { fsp: 3 }),
  ...timestamps,
}, (t) => [uniqueIndex('calendar_tokens_hash_unique').on(t.tokenHash), index('calendar_tokens_user_idx').on(t.userId)])

/** Seed prices the coordinator sets for the seed sale, per gram in the organisation's currency. */
export const seedPrices = mysqlTable('seed_prices', {
  id: id(),
  // lower-case scientific name, as the seed plan keys species
  speciesKey: varchar('species_key', { length: 200 }).notNull(),
  scientificName: varchar('scientific_name', { length: 200 }).notNull(),
  pricePerGram: decimal('price_per_gram', { precision: 10, scale: 4, mode: 'number' }).notNull(),
  setBy: ref('set_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, (t) => [uniqueIndex('seed_prices_species_unique').on(t.speciesKey)])
