// Demo mode, coordinators: the e-mail captured by the local fake SMTP server.
export default defineEventHandler(async (event) => {
  await requireRole(event, 'coordinator')
  const { mailCaptureUrl, public: { demoMode } } = useRuntimeConfig()
  if (!demoMode || !mailCaptureUrl) throw createError({ status: 404, message: 'Captured mail is shown in demo mode only' })
  const messages = await $fetch<unknown[]>('/messages', { baseURL: mailCaptureUrl })
  return { items: messages.slice(0, 200) }
})
