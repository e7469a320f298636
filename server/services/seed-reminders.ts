// E-mail reminders a few days before each seed task, through the shared job table (server/services/jobs.ts).
// One job per subscription and task; plan or date changes re-sync the set, and the handler re-checks at send time.
import { and, desc, eq, inArray, sql } from 'drizzle-orm'
import { randomBytes, createHash } from 'node:crypto'
import { calendarTokens, jobs, seedReminderSubscriptions, users, yards } from '../database/schema'
import type { AccountRow, YardRow } from '../database/schema'
import { enqueueJobs, cancelPendingJobs, JobCancelled, type NewJob } from './jobs'
import { yardAccessLevel } from './yard-access'
import { seedPlanFor } from './seed-plan'
import { addDays, isoDate, parseIsoDate } from '#shared/utils/seed-season'

export const SEED_REMINDER_KIND = 'seed-reminder'
// reminders go out at 13:00 UTC: morning across the Americas
const SEND_HOUR_UTC = 13

export interface SeedReminderPayload { subscriptionId: number; userId: number; yardId: number; taskId: string; taskDate: string }

const batchKeyOf = (subscriptionId: number) => `seed-reminders:${subscriptionId}`
const dedupeKeyOf = (subscriptionId: number, taskId: string) => `seed-reminder:${subscriptionId}:${taskId}`

export async function subscriptionFor(userId: number, yardId: number) {
  const [row] = await useDb().select().from(seedReminderSubscriptions)
    .where(and(eq(seedReminderSubscriptions.userId, userId), eq(seedReminderSubscriptions.yardId, yardId))).limit(1)
  return row ?? null
}

/** Opt in or out; opting in (again) schedules the season's reminders, opting out cancels the pending ones. */
export async function setSeedReminders(user: AccountRow, yard: YardRow, enabled: boolean, leadDays?: number) {
  const db = useDb()
  const existing = await subscriptionFor(user.id, yard.id)
  if (existing) {
    await db.update(seedReminderSubscriptions).set({ enabled, ...(leadDays !== undefined ? { leadDays } : {}) }).where(eq(seedReminderSubscriptions.id, existing.id))
  } else {
    await db.insert(seedReminderSubscriptions).ignore().values({ userId: user.id, yardId: yard.id, enabled, leadDays: leadDays ?? 3, unsubscribeToken: randomBytes(24).toString('base64url') })
  }
  const sub = (await subscriptionFor(user.id, yard.id))!
  if (enabled) await syncReminders(sub, yard)
  else await cancelPendingJobs(batchKeyOf(sub.id))
  return reminderStatus(sub)
}

export async function reminderStatus(sub: typeof seedReminderSubscriptions.$inferSelect | null) {
  if (!sub) return { enabled: false, leadDays: 3, scheduled: [] as Array<{ taskId: string; runAt: string; status: string }> }
  const rows = await useDb().select({ dedupeKey: jobs.dedupeKey, runAt: jobs.runAt, status: jobs.status, payload: jobs.payload }).from(jobs)
    .where(eq(jobs.batchKey, batchKeyOf(sub.id))).orderBy(jobs.runAt)
  return {
    enabled: sub.enabled,
    leadDays: sub.leadDays,
    scheduled: rows.filter((r) => r.status !== 'cancelled').map((r) => ({ taskId: String(r.payload.taskId), runAt: r.runAt.toISOString(), status: r.status })),
  }
}

/** Makes the pending reminders match the plan's current tasks (idempotent; safe to call from any instance). */
export async function syncReminders(sub: typeof seedReminderSubscriptions.$inferSelect, yard: YardRow, now = new Date()) {
  if (!sub.enabled) return
  const plan = await seedPlanFor(yard, isoDate(now))
  const today = isoDate(now)
  const wanted: NewJob[] = plan.tasks
    // an alternative route would only be noise in the inbox; a task whose window has closed needs no reminding
    .filter((t) => !t.optional && (t.endDate ?? t.date) >= today)
    .map((t) => {
      const at = addDays(parseIsoDate(t.date), -sub.leadDays)
      at.setUTCHours(SEND_HOUR_UTC)
      return {
        kind: SEED_REMINDER_KIND,
        payload: { subscriptionId: sub.id, userId: sub.userId, yardId: sub.yardId, taskId: t.id, taskDate: t.date } satisfies SeedReminderPayload,
        runAt: at.getTime() < now.getTime() ? now : at,
        dedupeKey: dedupeKeyOf(sub.id, t.id),
        batchKey: batchKeyOf(sub.id),
      }
    })
  await cancelPendingJobs(batchKeyOf(sub.id), wanted.map((j) => j.dedupeKey))
  await enqueueJobs(wanted, { reschedule: true })
}

/** After a plan edit: every subscriber of the yard. */
export async function syncYardReminders(yard: YardRow) {
  const subs = await useDb().select().from(seedReminderSubscriptions)
    .where(and(eq(seedReminderSubscriptions.yardId, yard.id), eq(seedReminderSubscriptions.enabled, true)))
  for (const sub of subs) await syncReminders(sub, yard)
}

/** The job handler: re-checks the opt-in, the access and the task, then sends one mail. */
export async function sendSeedReminder(payload: SeedReminderPayload) {
  const db = useDb()
  const [sub] = await db.select().from(seedReminderSubscriptions).where(eq(seedReminderSubscriptions.id, payload.subscriptionId)).limit(1)
  if (!sub || !sub.enabled) throw new JobCancelled('unsubscribed')
  const [user] = await db.select().from(users).where(eq(users.id, sub.userId)).limit(1)
  const [yard] = await db.select().from(yards).where(eq(yards.id, sub.yardId)).limit(1)
  if (!user || !yard) throw new JobCancelled('user or yard deleted')
  if (!(await yardAccessLevel(user, yard))) throw new JobCancelled('no longer has access to the yard')
  const plan = await seedPlanFor(yard)
  const task = plan.tasks.find((t) => t.id === payload.taskId)
  if (!task) {
    await syncReminders(sub, yard)
    throw new JobCancelled('the task moved or was removed; reminders re-synced')
  }
  const unsubscribe = appLink(`/seed-reminders/unsubscribe?token=${sub.unsubscribeToken}`)
  const page = appLink(`/yards/${yard.id}/seeds`)
  const days = Math.round((parseIsoDate(task.date).getTime() - parseIsoDate(isoDate(new Date())).getTime()) / 86_400_000)
  const when = days <= 0 ? 'today' : days === 1 ? 'tomorrow' : `in ${days} days`
  await sendMail({
    to: user.email,
    subject: `${task.title.split(':')[0]} ${when}: ${yard.name}`,
    text: [
      `Hello ${user.name},`,
      '',
      `${task.title} — ${task.date}${task.endDate ? ` to ${task.endDate}` : ''} (${when}).`,
      '',
      task.detail,
      '',
      task.species.length ? `Species: ${task.species.join(', ')}.` : '',
      `The whole plan: ${page}`,
      '',
      `You get these reminders because you turned them on for ${yard.name}. Stop them: ${unsubscribe}`,
    ].join('\n'),
    headers: {
      'List-Unsubscribe': `<${unsubscribe}>`,
      'List-Unsubscribe-Post': 'List-Unsubscribe=One-Click',
    },
  })
}

export async function unsubscribeByToken(token: string): Promise<{ yardName: string } | null> {
  const db = useDb()
  const [sub] = await db.select().from(seedReminderSubscriptions).where(eq(seedReminderSubscriptions.unsubscribeToken, token)).limit(1)
  if (!sub) return null
  await db.update(seedReminderSubscriptions).set({ enabled: false }).where(eq(seedReminderSubscriptions.id, sub.id))
  await cancelPendingJobs(batchKeyOf(sub.id))
  const [yard] = await db.select({ name: yards.name }).from(yards).where(eq(yards.id, sub.yardId)).limit(1)
  return { yardName: yard?.name ?? 'your yard' }
}

/** For the coordinator: the latest reminders (sent first), with whom and which yard, and counts by status. */
export async function reminderLog(limit = 200) {
  const db = useDb()
  const rows = await db.select().from(jobs).where(eq(jobs.kind, SEED_REMINDER_KIND))
    .orderBy(desc(sql`coalesce(${jobs.sentAt}, ${jobs.runAt})`)).limit(limit)
  const counts = await db.select({ status: jobs.status, n: sql<number>`count(*)` }).from(jobs).where(eq(jobs.kind, SEED_REMINDER_KIND)).groupBy(jobs.status)
  const userIds = [...new Set(rows.map((r) => Number(r.payload.userId)))]
  const yardIds = [...new Set(rows.map((r) => Number(r.payload.yardId)))]
  const people = userIds.length ? await db.select({ id: users.id, name: users.name, email: users.email }).from(users).where(inArray(users.id, userIds)) : []
  const places = yardIds.length ? await db.select({ id: yards.id, name: yards.name }).from(yards).where(inArray(yards.id, yardIds)) : []
  const person = new Map(people.map((p) => [p.id, p]))
  const place = new Map(places.map((p) => [p.id, p.name]))
  return {
    counts: Object.fromEntries(counts.map((c) => [c.status, Number(c.n)])),
    reminders: rows.map((r) => {
      const p = r.payload as unknown as SeedReminderPayload
      return {
        id: r.id, status: r.status, runAt: r.runAt.toISOString(), sentAt: r.sentAt?.toISOString() ?? null,
        attempts: r.attempts, lastError: r.lastError, taskId: p.taskId, taskDate: p.taskDate,
        user: person.get(p.userId) ?? null, yard: { id: p.yardId, name: place.get(p.yardId) ?? null },
      }
    }),
  }
}

// ---------------------------------------------------------------------------------------------------------------
// Private calendar address: a random secret in the URL, only its sha-256 stored; one live address per user

const hashToken = (token: string) => createHash('sha256').update(token).digest('hex')

export async function calendarStatus(userId: number) {
  const [row] = await useDb().select({ createdAt: calendarTokens.createdAt, lastUsedAt: calendarTokens.lastUsedAt }).from(calendarTokens)
    .where(and(eq(calendarTokens.userId, userId), sql`${calendarTokens.revokedAt} is null`)).orderBy(desc(calendarTokens.id)).limit(1)
  return row ? { active: true, createdAt: row.createdAt.toISOString(), lastUsedAt: row.lastUsedAt?.toISOString() ?? null } : { active: false, createdAt: null, lastUsedAt: null }
}

/** A new address (the old one stops working); the secret is shown this once. */
export async function newCalendarToken(userId: number): Promise<string> {
  const token = randomBytes(32).toString('base64url')
  await withContentionRetry(() => useDb().transaction(async (tx) => {
    // one new address at a time per user: the account row's lock orders concurrent requests
    await tx.select({ id: users.id }).from(users).where(eq(users.id, userId)).for('update')
    await tx.update(calendarTokens).set({ revokedAt: new Date() }).where(and(eq(calendarTokens.userId, userId), sql`${calendarTokens.revokedAt} is null`))
    await tx.insert(calendarTokens).values({ userId, tokenHash: hashToken(token) })
  }))
  return token
}

export async function revokeCalendarTokens(userId: number) {
  await useDb().update(calendarTokens).set({ revokedAt: new Date() }).where(and(eq(calendarTokens.userId, userId), sql`${calendarTokens.revokedAt} is null`))
}

export async function userForCalendarToken(token: string): Promise<AccountRow | null> {
  const db = useDb()
  const [row] = await db.select({ id: calendarTokens.id, userId: calendarTokens.userId }).from(calendarTokens)
    .where(and(eq(calendarTokens.tokenHash, hashToken(token)), sql`${calendarTokens.revokedAt} is null`)).limit(1)
  if (!row) return null
  await db.update(calendarTokens).set({ lastUsedAt: new Date() }).where(eq(calendarTokens.id, row.id))
  const [user] = await db.select().from(users).where(eq(users.id, row.userId)).limit(1)
  return user ?? null
}

export function calendarFeedPath(token: string) {
  return `/calendar/${token}/seeds.ics`
}
