// Demo mode (sample accounts with a published password, captured e-mail) is only for a machine's own use:
// allowed when the server listens on loopback, or when asked for explicitly (NUXT_DEMO_EXPLICIT=true).
import { isIP } from 'node:net'

/** True for an address only this machine can reach: 127.0.0.0/8, ::1, "localhost". */
export function isLoopbackHost(host: string | undefined): boolean {
  if (!host) return false
  const h = host.replace(/^\[|\]$/g, '').toLowerCase()
  if (h === 'localhost' || h === '::1') return true
  return isIP(h) === 4 && h.startsWith('127.')
}

/** Why demo mode may not run here, or null when it may. */
export function demoRefusal(env: Record<string, string | undefined>, demoOn: boolean, explicit: boolean): string | null {
  if (!demoOn || explicit) return null
  const host = env.NITRO_HOST || env.HOST
  if (isLoopbackHost(host)) return null
  return `Demo mode (published demo passwords, captured e-mail) is refused on ${host ? `host ${host}` : 'every interface'}: listen on 127.0.0.1, turn demo off (WW_DEMO=false), or set NUXT_DEMO_EXPLICIT=true`
}

/** Mail captured in demo mode as one coordinator may see it: nobody else's reset link is shown live. */
export function redactCapturedMail<T extends { to?: string[]; text?: string; html?: string }>(messages: T[], viewerEmail: string): T[] {
  const viewer = viewerEmail.toLowerCase()
  const hide = (s: string | undefined) => s?.replace(/(reset-password\?token=)[A-Za-z0-9_%.~-]+/g, '$1[hidden: sent to another account]')
  return messages.map((m) => (m.to ?? []).some((t) => t.toLowerCase().includes(viewer)) ? m : { ...m, text: hide(m.text), html: hide(m.html) })
}
