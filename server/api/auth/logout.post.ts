// Sign out: ends the session on the server (the clear hook in server/plugins/accounts.ts) and clears the cookie.
export default defineEventHandler(async (event) => {
  await clearUserSession(event)
  return { ok: true }
})
