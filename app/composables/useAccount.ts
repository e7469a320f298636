import type { Role } from '#shared/types/roles'
import { clearOfflineCaches } from '~/utils/offline-pages'

/** The signed-in account (from nuxt-auth-utils' session) with role checks for navigation and page guards. */
export function useAccount() {
  const { loggedIn, user, fetch: refreshSession, clear } = useUserSession()
  const role = computed<Role | null>(() => (user.value?.role as Role | undefined) ?? null)
  const is = (...roles: Role[]) => !!role.value && roles.includes(role.value)

  async function signOut() {
    await $fetch('/api/auth/logout', { method: 'POST' })
    await clear()
    await clearOfflineCaches()
    await navigateTo('/login')
  }

  return { loggedIn, user, role, is, refreshSession, signOut }
}
