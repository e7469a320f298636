// The unsubscribe link in seed reminders: a page with one button (a GET alone changes nothing, since mail
// scanners follow links).
import { unsubscribeQuery } from '#shared/schemas/seed'

const escape = (s: string) => s.replace(/[&<>"']/g, (c) => `&#${c.charCodeAt(0)};`)

export default defineEventHandler((event) => {
  const { token } = readQueryWith(event, unsubscribeQuery)
  setHeader(event, 'content-type', 'text/html; charset=utf-8')
  return `<!doctype html><html lang="en"><head><meta charset="utf-8"><meta name="viewport" content="width=device-width, initial-scale=1"><title>Stop seed reminders · Wildward</title>
<style>body{font-family:system-ui,sans-serif;max-width:32rem;margin:4rem auto;padding:0 1rem;color:#2b2b2b}button{background:#2f5d50;color:#fff;border:0;border-radius:.5rem;padding:.6rem 1.2rem;font-size:1rem;cursor:pointer}</style></head>
<body><h1>Stop seed reminders?</h1><p>You will get no more e-mail reminders about sowing and planting out for this yard. You can turn them on again on the yard's Grow from seed page.</p>
<form method="post" action="/seed-reminders/unsubscribe?token=${escape(token)}"><button type="submit">Stop reminders</button></form></body></html>`
})
