// Demo mode, coordinators: the e-mail captured by the local fake SMTP server (others' reset links hidden).
import { redactCapturedMail } from '../../utils/demo'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'coordinator')
  const { mailCaptureUrl, public: { demoMode } } = useRuntimeConfig()
  if (!demoMode || !mailCaptureUrl) throw createError({ status: 404, message: 'Captured mail is shown in demo mode only' })
  const messages = await $fetch<Array<{ to?: string[]; text?: string; html?: string }>>('/messages', { baseURL: mailCaptureUrl })
  return { items: redactCapturedMail(messages.slice(0, 200), user.email) }
})
