import { mysqlTable, varchar, mysqlEnum, text, json, int, double, date, char, timestamp, index, uniqueIndex } from 'drizzle-orm/mysql-core'
import { id, ref, timestamps } from './columns'
import { users } from './accounts'
import { yards } from './yards'
import type { RecommendationChange, PredictedShares } from '../../../shared/schemas/advice'

export const INVITE_ROLES = ['viewer', 'editor'] as const

/** An e-mail invitation to share a yard; accepting it adds a yard_members row, revoking removes it. */
export const yardInvites = mysqlTable('yard_invites', {
  id: id(),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  email: varchar('email', { length: 254 }).notNull(),
  role: mysqlEnum('role', INVITE_ROLES).notNull(),
  // sha-256 of the token in the link; the token itself is never stored
  tokenHash: char('token_hash', { length: 64 }).notNull(),
  invitedBy: ref('invited_by').notNull().references(() => users.id, { onDelete: 'cascade' }),
  acceptedBy: ref('accepted_by').references(() => users.id, { onDelete: 'set null' }),
  acceptedAt: timestamp('accepted_at', { fsp: 3 }),
  revokedAt: timestamp('revoked_at', { fsp: 3 }),
  expiresAt: timestamp('expires_at', { fsp: 3 }).notNull(),
  ...timestamps,
}, (t) => [
  uniqueIndex('yard_invites_token_unique').on(t.tokenHash),
  index('yard_invites_yard_idx').on(t.yardId, t.revokedAt),
  index('yard_invites_email_idx').on(t.email),
])

export const ADVICE_STATUSES = ['new', 'assigned', 'closed'] as const

/** A homeowner's request for an advisor's visit; the assigned advisor may edit the yard while it is not closed. */
export const adviceRequests = mysqlTable('advice_requests', {
  id: id(),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  requesterId: ref('requester_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  message: text('message').notNull(),
  preferredTimes: varchar('preferred_times', { length: 500 }).notNull().default(''),
  status: mysqlEnum('status', ADVICE_STATUSES).notNull().default('new'),
  advisorId: ref('advisor_id').references(() => users.id, { onDelete: 'set null' }),
  assignedBy: ref('assigned_by').references(() => users.id, { onDelete: 'set null' }),
  assignedAt: timestamp('assigned_at', { fsp: 3 }),
  closedAt: timestamp('closed_at', { fsp: 3 }),
  closingNote: varchar('closing_note', { length: 500 }),
  ...timestamps,
}, (t) => [
  index('advice_requests_status_idx').on(t.status, t.createdAt),
  index('advice_requests_advisor_idx').on(t.advisorId, t.status),
  index('advice_requests_yard_idx').on(t.yardId, t.status),
])

/** An advisor's site visit for a request: notes, photos, pins and recommendations hang off it. */
export const siteVisits = mysqlTable('site_visits', {
  id: id(),
  requestId: ref('request_id').notNull().references(() => adviceRequests.id, { onDelete: 'cascade' }),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  advisorId: ref('advisor_id').notNull().references(() => users.id, { onDelete: 'cascade' }),
  visitedOn: date('visited_on', { mode: 'string' }).notNull(),
  notes: text('notes').notNull(),
  ...timestamps,
}, (t) => [index('site_visits_request_idx').on(t.requestId), index('site_visits_yard_idx').on(t.yardId)])

export const visitPhotos = mysqlTable('visit_photos', {
  id: id(),
  visitId: ref('visit_id').notNull().references(() => siteVisits.id, { onDelete: 'cascade' }),
  // the key under which server/utils/storage.ts keeps the bytes
  storageKey: varchar('storage_key', { length: 200 }).notNull(),
  contentType: varchar('content_type', { length: 60 }).notNull(),
  bytes: int('bytes', { unsigned: true }).notNull(),
  caption: varchar('caption', { length: 300 }).notNull().default(''),
  ...timestamps,
}, (t) => [index('visit_photos_visit_idx').on(t.visitId)])

/** A comment pinned to a spot on the plan (metres, the document's frame). */
export const visitPins = mysqlTable('visit_pins', {
  id: id(),
  visitId: ref('visit_id').notNull().references(() => siteVisits.id, { onDelete: 'cascade' }),
  x: double('x').notNull(),
  y: double('y').notNull(),
  comment: varchar('comment', { length: 1000 }).notNull(),
  ...timestamps,
}, (t) => [index('visit_pins_visit_idx').on(t.visitId)])

export const RECOMMENDATION_STATUSES = ['proposed', 'accepted', 'declined'] as const

/** A structured change to the plan with the shares predicted for it; the homeowner accepts or declines it. */
export const recommendations = mysqlTable('recommendations', {
  id: id(),
  visitId: ref('visit_id').notNull().references(() => siteVisits.id, { onDelete: 'cascade' }),
  yardId: ref('yard_id').notNull().references(() => yards.id, { onDelete: 'cascade' }),
  change: json('change').$type<RecommendationChange>().notNull(),
  summary: varchar('summary', { length: 400 }).notNull(),
  predicted: json('predicted').$type<PredictedShares>().notNull(),
  // the yard version the prediction was made against
  basedOnVersion: int('based_on_version', { unsigned: true }).notNull(),
  status: mysqlEnum('status', RECOMMENDATION_STATUSES).notNull().default('proposed'),
  decidedBy: ref('decided_by').references(() => users.id, { onDelete: 'set null' }),
  decidedAt: timestamp('decided_at', { fsp: 3 }),
  declineReason: varchar('decline_reason', { length: 500 }),
  appliedVersion: int('applied_version', { unsigned: true }),
  ...timestamps,
}, (t) => [index('recommendations_yard_idx').on(t.yardId, t.status), index('recommendations_visit_idx').on(t.visitId)])
