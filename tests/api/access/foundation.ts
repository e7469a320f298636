import type { AccessRow } from './types'

const ALL_200 = { anonymous: 200, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 }
const SIGNED_IN = { anonymous: 401, owner: 200, otherHomeowner: 200, advisor: 200, coordinator: 200 }
const COORDINATOR = { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 403, coordinator: 200 }
const OWNER_ONLY = { anonymous: 401, owner: 200, otherHomeowner: 404, advisor: 404, coordinator: 404 }

let n = 0
const unique = () => `matrix-${Date.now()}-${++n}@example.test`

export const rows: AccessRow[] = [
  { file: 'health.get.ts', method: 'GET', request: () => ({ path: '/api/health' }), expect: ALL_200 },
  {
    file: 'auth/login.post.ts', method: 'POST',
    // a wrong password is 401 for everyone: the route is open, the credentials decide
    request: () => ({ path: '/api/auth/login', body: { email: 'nobody@example.test', password: 'not-the-password' } }),
    expect: { anonymous: 401, owner: 401, otherHomeowner: 401, advisor: 401, coordinator: 401 },
  },
  {
    file: 'auth/register.post.ts', method: 'POST',
    request: () => ({ path: '/api/auth/register', body: { email: unique(), name: 'Matrix', password: 'a-long-test-password' } }),
    expect: { anonymous: 201, owner: 201, otherHomeowner: 201, advisor: 201, coordinator: 201 },
  },
  { file: 'auth/logout.post.ts', method: 'POST', request: () => ({ path: '/api/auth/logout' }), expect: ALL_200 },
  { file: 'auth/me.get.ts', method: 'GET', request: () => ({ path: '/api/auth/me' }), expect: SIGNED_IN },
  { file: 'auth/forgot-password.post.ts', method: 'POST', request: () => ({ path: '/api/auth/forgot-password', body: { email: 'nobody@example.test' } }), expect: ALL_200 },
  {
    file: 'auth/reset-password.post.ts', method: 'POST',
    request: () => ({ path: '/api/auth/reset-password', body: { token: 'x'.repeat(43), password: 'a-long-test-password' } }),
    expect: { anonymous: 400, owner: 400, otherHomeowner: 400, advisor: 400, coordinator: 400 },
  },
  {
    file: 'auth/password.put.ts', method: 'PUT',
    // a wrong current password: 400 once signed in, 401 before
    request: () => ({ path: '/api/auth/password', body: { currentPassword: 'wrong-password', newPassword: 'another-long-password' } }),
    expect: { anonymous: 401, owner: 400, otherHomeowner: 400, advisor: 400, coordinator: 400 },
  },
  { file: 'users/index.get.ts', method: 'GET', request: () => ({ path: '/api/users' }), expect: COORDINATOR },
  {
    file: 'users/[id]/role.put.ts', method: 'PUT',
    request: () => ({ path: '/api/users/999999999/role', body: { role: 'advisor' } }),
    expect: { anonymous: 401, owner: 403, otherHomeowner: 403, advisor: 403, coordinator: 404 },
  },
  { file: 'admin/mail.get.ts', method: 'GET', request: () => ({ path: '/api/admin/mail' }), expect: COORDINATOR },
  { file: 'yards/index.get.ts', method: 'GET', request: () => ({ path: '/api/yards' }), expect: SIGNED_IN },
  {
    file: 'yards/index.post.ts', method: 'POST',
    request: () => ({ path: '/api/yards', body: { name: 'Matrix yard', region: 'US-OH' } }),
    expect: { anonymous: 401, owner: 201, otherHomeowner: 201, advisor: 201, coordinator: 201 },
  },
  { file: 'yards/[id].get.ts', method: 'GET', request: (c) => ({ path: `/api/yards/${c.yardId}` }), expect: OWNER_ONLY },
  {
    file: 'yards/[id].put.ts', method: 'PUT',
    request: async (c) => ({ path: `/api/yards/${await c.freshYard()}`, body: { version: 1, name: 'Renamed' } }),
    expect: OWNER_ONLY,
  },
  {
    file: 'yards/[id].delete.ts', method: 'DELETE',
    request: async (c) => ({ path: `/api/yards/${await c.freshYard()}` }),
    expect: { anonymous: 401, owner: 204, otherHomeowner: 404, advisor: 404, coordinator: 404 },
  },
]
