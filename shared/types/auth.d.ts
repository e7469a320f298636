import type { Role } from './roles'

// The session user kept in nuxt-auth-utils' sealed cookie. The role is re-read from the database on the
// server for every check, so a role change takes effect at once.
declare module '#auth-utils' {
  interface User {
    id: number
    email: string
    name: string
    role: Role
  }
  // server-only part of the sealed cookie: the token of the session row (server/services/sessions.ts)
  interface SecureSessionData {
    token: string
  }
}

export {}
