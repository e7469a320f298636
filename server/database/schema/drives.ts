import { mysqlTable, varchar, mysqlEnum, text, int, tinyint, double, date, decimal, boolean, timestamp, json, index, uniqueIndex, primaryKey } from 'drizzle-orm/mysql-core'
import { sql } from 'drizzle-orm'
import { id, ref, timestamps } from './columns'
import { users } from './accounts'
import { yards } from './yards'

export const SHARE_KINDS = ['count', 'area', 'volume'] as const

/** A pledge drive run by the organisation: the running one is the one whose dates include today. */
export const drives = mysqlTable('drives', {
  id: id(),
  name: varchar('name', { length: 160 }).notNull(),
  startsOn: date('starts_on', { mode: 'string' }).notNull(),
  endsOn: date('ends_on', { mode: 'string' }).notNull(),
  goal: decimal('goal', { precision: 4, scale: 3, mode: 'number' }).notNull().default(0.7),
  certifies: mysqlEnum('certifies', SHARE_KINDS).notNull().default('area'),
  target: int('target', { unsigned: true }).notNull(),
  createdBy: ref('created_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, (t) => [index('drives_dates_idx').on(t.startsOn, t.endsOn)])

/** The shares as numbers, the same columns on a pledge (now and at pledge time) and on a snapshot. */
const shareColumns = (prefix: string) => ({
  countNative: double(`${prefix}count_native`).notNull().default(0),
  countTotal: double(`${prefix}count_total`).notNull().default(0),
  countShare: double(`${prefix}count_share`).notNull().default(0),
  areaNative: double(`${prefix}area_native`).notNull().default(0),
  areaTotal: double(`${prefix}area_total`).notNull().default(0),
  areaShare: double(`${prefix}area_share`).notNull().default(0),
  volumeNative: double(`${prefix}volume_native`).notNull().default(0),
  volumeTotal: double(`${prefix}volume_total`).notNull().default(0),
  volumeShare: double(`${prefix}volume_share`).notNull().default(0),
  lawnArea: double(`${prefix}lawn_area`).notNull().default(0),
})

export const PLEDGE_STATUSES = ['pledged', 'reached', 'verified'] as const

/**
 * A yard pledged to a drive. The current shares are kept on the row (refreshed on every save of the yard) so
 * the dashboard aggregates over indexed columns instead of scoring every yard; `base*` are the shares at pledge.
 */
export const pledges = mysqlTable('pledges', {
  id: id(),
  driveId: ref('drive_id').notNull().references(() => drives.id, { onDelete: 'cascade' }),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  userId: ref('user_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  // neighbourhood name or postal code, as the household gave it (trimmed, case kept for display)
  neighbourhood: varchar('neighbourhood', { length: 80 }).notNull(),
  consent: boolean('consent').notNull(),
  status: mysqlEnum('status', PLEDGE_STATUSES).notNull().default('pledged'),
  pledgedOn: date('pledged_on', { mode: 'string' }).notNull(),
  ...shareColumns(''),
  // the shares with the plan (the columns above are the yard as it is now, which the status is judged on)
  plannedCountShare: double('planned_count_share').notNull().default(0),
  plannedAreaShare: double('planned_area_share').notNull().default(0),
  plannedVolumeShare: double('planned_volume_share').notNull().default(0),
  // the histogram bin (tenths, a share of 1 in the last) of each share, kept by the database for an index-only count
  countBin: tinyint('count_bin').generatedAlwaysAs(sql`LEAST(FLOOR(count_share * 10), 9)`, { mode: 'stored' }),
  areaBin: tinyint('area_bin').generatedAlwaysAs(sql`LEAST(FLOOR(area_share * 10), 9)`, { mode: 'stored' }),
  volumeBin: tinyint('volume_bin').generatedAlwaysAs(sql`LEAST(FLOOR(volume_share * 10), 9)`, { mode: 'stored' }),
  baseAreaNative: double('base_area_native').notNull().default(0),
  baseLawnArea: double('base_lawn_area').notNull().default(0),
  baseShare: double('base_share').notNull().default(0),
  reachedAt: timestamp('reached_at', { fsp: 3 }),
  verifiedAt: timestamp('verified_at', { fsp: 3 }),
  verifiedBy: ref('verified_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, (t) => [
  uniqueIndex('pledges_yard_drive_unique').on(t.yardId, t.driveId),
  index('pledges_drive_status_idx').on(t.driveId, t.consent, t.status),
  // covers every dashboard aggregate (totals, bins, neighbourhoods), so they read the index and never the rows
  index('pledges_dashboard_idx').on(t.driveId, t.consent, t.neighbourhood, t.status, t.countShare, t.areaShare, t.volumeShare,
    t.areaNative, t.baseAreaNative, t.lawnArea, t.baseLawnArea),
  index('pledges_drive_count_bin_idx').on(t.driveId, t.consent, t.countBin),
  index('pledges_drive_area_bin_idx').on(t.driveId, t.consent, t.areaBin),
  index('pledges_drive_volume_bin_idx').on(t.driveId, t.consent, t.volumeBin),
  // the table's sorts
  index('pledges_drive_count_idx').on(t.driveId, t.consent, t.countShare),
  index('pledges_drive_area_idx').on(t.driveId, t.consent, t.areaShare),
  index('pledges_drive_volume_idx').on(t.driveId, t.consent, t.volumeShare),
  // pledges per day, and the join to snapshots for progress over time
  index('pledges_drive_day_yard_idx').on(t.driveId, t.consent, t.pledgedOn, t.yardId),
])

/** The shares of a pledged yard on one day (the day's last save wins), for progress over time. */
export const shareSnapshots = mysqlTable('share_snapshots', {
  id: id(),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  day: date('day', { mode: 'string' }).notNull(),
  ...shareColumns(''),
  ...timestamps,
}, (t) => [
  uniqueIndex('share_snapshots_yard_day_unique').on(t.yardId, t.day),
  index('share_snapshots_day_idx').on(t.day),
  // progress over time reads each yard's days and shares from the index alone
  index('share_snapshots_yard_day_shares_idx').on(t.yardId, t.day, t.countShare, t.areaShare, t.volumeShare),
])

/**
 * Each drive's version, shared by every instance: every change the app makes to a drive's pledges bumps it, and
 * a dashboard view computed for an older version (or over a minute ago, which covers a pledged yard deleted with
 * its pledge) is computed again.
 */
export const driveSummaries = mysqlTable('drive_summaries', {
  driveId: ref('drive_id').primaryKey().references(() => drives.id, { onDelete: 'cascade' }),
  version: int('version', { unsigned: true }).notNull().default(1),
})

/** The dashboard's views of a drive (summary, progress over time, neighbourhoods), each as last computed. */
export const driveViewCache = mysqlTable('drive_view_cache', {
  driveId: ref('drive_id').notNull().references(() => drives.id, { onDelete: 'cascade' }),
  view: varchar('view', { length: 32 }).notNull(),
  body: json('body').$type<Record<string, unknown>>().notNull(),
  bodyVersion: int('body_version', { unsigned: true }).notNull(),
  computedAt: timestamp('computed_at', { fsp: 3 }).notNull(),
}, (t) => [primaryKey({ columns: [t.driveId, t.view] })])

export const MAILING_KINDS = ['reminder', 'thanks'] as const
export const MAILING_AUDIENCES = ['all', 'pledged', 'reached', 'verified'] as const

/** A bulk mail to a drive's pledgers; one job per recipient in the shared job table, grouped by `batch`. */
export const driveMailings = mysqlTable('drive_mailings', {
  id: id(),
  driveId: ref('drive_id').notNull().references(() => drives.id, { onDelete: 'cascade' }),
  kind: mysqlEnum('kind', MAILING_KINDS).notNull(),
  audience: mysqlEnum('audience', MAILING_AUDIENCES).notNull(),
  subject: varchar('subject', { length: 200 }).notNull(),
  body: text('body').notNull(),
  batch: varchar('batch', { length: 80 }).notNull(),
  recipients: int('recipients', { unsigned: true }).notNull().default(0),
  createdBy: ref('created_by').references(() => users.id, { onDelete: 'set null' }),
  ...timestamps,
}, (t) => [index('drive_mailings_drive_idx').on(t.driveId)])

/** One row per mail actually handed to SMTP: the unique key keeps a retried or doubled job from mailing twice. */
export const driveMailDeliveries = mysqlTable('drive_mail_deliveries', {
  id: id(),
  mailingId: ref('mailing_id').notNull().references(() => driveMailings.id, { onDelete: 'cascade' }),
  pledgeId: ref('pledge_id').notNull().references(() => pledges.id, { onDelete: 'cascade' }),
  sentAt: timestamp('sent_at', { fsp: 3 }).notNull().defaultNow(),
}, (t) => [uniqueIndex('drive_mail_deliveries_unique').on(t.mailingId, t.pledgeId)])

export type DriveRow = typeof drives.$inferSelect
export type PledgeRow = typeof pledges.$inferSelect
