// Accounts in every instance: the password-reset mail job, sessions ended on the server when a cookie is cleared,
// and the client's session probe answering only for live sessions.
import { registerJobHandler } from '../services/jobs'
import { PASSWORD_RESET_JOB, sendPasswordReset } from '../services/accounts'
import { endSession, liveSessionUser } from '../services/sessions'

export default defineNitroPlugin(() => {
  const config = useRuntimeConfig()
  // __Host- cookies must be Secure, Path=/ and carry no Domain: only possible where the app is served over HTTPS
  if (/^https:/i.test(config.appUrl) && !config.session.name?.startsWith('__Host-')) {
    const session = config.session as { name?: string; cookie?: Record<string, unknown> }
    session.name = `__Host-${session.name || 'wildward-session'}`
    session.cookie = { ...session.cookie, secure: true, path: '/', domain: undefined }
  }

  registerJobHandler<{ email: string }>(PASSWORD_RESET_JOB, (payload) => sendPasswordReset(payload))

  // every way a cookie is cleared (sign-out, nuxt-auth-utils' own DELETE /api/_auth/session) ends the session row
  sessionHooks.hook('clear', async (session) => {
    const token = (session as { secure?: { token?: string } }).secure?.token
    if (token) await endSession(token)
  })
  // the client asks GET /api/_auth/session whether someone is signed in: a session ended on the server is not
  sessionHooks.hook('fetch', async (session, event) => {
    const token = (session as { secure?: { token?: string } }).secure?.token
    if (!token || !(await liveSessionUser(token))) {
      await clearUserSession(event)
      throw createError({ status: 401, message: 'Please sign in' })
    }
  })
})
