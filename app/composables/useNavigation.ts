import type { Role } from '#shared/types/roles'

export interface NavItem {
  to: string
  label: string
  roles?: Role[]
}

// The signed-in navigation; an item without roles is for everyone signed in.
const ITEMS: NavItem[] = [
  { to: '/yards', label: 'My yards' },
  { to: '/species', label: 'Species' },
  { to: '/find-plants', label: 'Find plants' },
  { to: '/sale', label: 'Seed sale' },
  { to: '/advice', label: 'Advice', roles: ['advisor', 'coordinator'] },
  { to: '/drive', label: 'Pledge drive', roles: ['coordinator'] },
  { to: '/admin/sale', label: 'Sale orders', roles: ['coordinator'] },
  { to: '/admin/seed', label: 'Seed prices', roles: ['coordinator'] },
  { to: '/admin/users', label: 'People', roles: ['coordinator'] },
  { to: '/admin/catalogue', label: 'Species list', roles: ['coordinator'] },
  { to: '/admin/mail', label: 'Sent mail', roles: ['coordinator'] },
]

export function useNavigation() {
  const { role } = useAccount()
  const config = useRuntimeConfig()
  return computed(() => ITEMS.filter((i) => (!i.roles || (role.value && i.roles.includes(role.value)))
    && (i.to !== '/admin/mail' || config.public.demoMode)))
}
