import { mysqlTable, varchar, json, int, timestamp, mysqlEnum, index, uniqueIndex } from 'drizzle-orm/mysql-core'
import { id, timestamps } from './columns'

// The shared background-job table (reminders, thank-you mails, bulk sends). How to use it: server/services/jobs.ts.
export const JOB_STATUSES = ['pending', 'claimed', 'sent', 'failed', 'cancelled'] as const
export type JobStatus = (typeof JOB_STATUSES)[number]

export const jobs = mysqlTable('jobs', {
  id: id(),
  // which handler runs it, e.g. "seed-reminder", "pledge-thank-you"
  kind: varchar('kind', { length: 64 }).notNull(),
  payload: json('payload').$type<Record<string, unknown>>().notNull(),
  runAt: timestamp('run_at', { fsp: 3 }).notNull(),
  // one job per key, ever: enqueueing the same key again changes nothing (or reschedules, when asked)
  dedupeKey: varchar('dedupe_key', { length: 191 }).notNull(),
  // groups jobs for a progress bar or a bulk cancel, e.g. "drive-12:reminder-3"
  batchKey: varchar('batch_key', { length: 128 }),
  status: mysqlEnum('status', JOB_STATUSES).notNull().default('pending'),
  attempts: int('attempts', { unsigned: true }).notNull().default(0),
  maxAttempts: int('max_attempts', { unsigned: true }).notNull().default(5),
  claimedBy: varchar('claimed_by', { length: 96 }),
  claimedAt: timestamp('claimed_at', { fsp: 3 }),
  sentAt: timestamp('sent_at', { fsp: 3 }),
  lastError: varchar('last_error', { length: 2000 }),
  ...timestamps,
}, (t) => [
  uniqueIndex('jobs_dedupe_key_unique').on(t.dedupeKey),
  // claiming: due pending rows in run_at order, and stale claims
  index('jobs_status_run_at_idx').on(t.status, t.runAt),
  index('jobs_status_claimed_at_idx').on(t.status, t.claimedAt),
  // progress bars: counts by status within a batch
  index('jobs_batch_status_idx').on(t.batchKey, t.status),
])

export type JobRow = typeof jobs.$inferSelect
