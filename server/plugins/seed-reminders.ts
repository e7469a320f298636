// Registers the seed-reminder job kind with this instance's job runner (server/plugins/jobs.ts runs it).
import { registerJobHandler } from '../services/jobs'
import { SEED_REMINDER_KIND, sendSeedReminder, type SeedReminderPayload } from '../services/seed-reminders'

export default defineNitroPlugin(() => {
  registerJobHandler<SeedReminderPayload>(SEED_REMINDER_KIND, (payload) => sendSeedReminder(payload))
})
