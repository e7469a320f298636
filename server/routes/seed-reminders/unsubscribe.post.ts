// Stops seed reminders for the subscription named by the token (the page's button, or a mail client's one-click).
import { unsubscribeQuery } from '#shared/schemas/seed'
import { unsubscribeByToken } from '../../services/seed-reminders'

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)

export default defineEventHandler(async (event) => {
  const { token } = readQueryWith(event, unsubscribeQuery)
  const done = await unsubscribeByToken(token)
  if (!done) throw createError({ status: 404, message: 'This link is not valid (any more)' })
  setHeader(event, 'content-type', 'text/html; charset=utf-8')
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><title>Reminders stopped · Wildward</title></head>
<body style="font-family:system-ui,sans-serif;max-width:32rem;margin:4rem auto;padding:0 1rem"><h1>Reminders stopped</h1><p>No more seed reminders for ${escape(done.yardName)}.</p></body></html>`
})
