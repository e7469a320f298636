export const ROLE_NAMES = ['homeowner', 'advisor', 'coordinator'] as const
export type Role = (typeof ROLE_NAMES)[number]

export const ROLE_LABELS: Record<Role, string> = {
  homeowner: 'Homeowner',
  advisor: 'Volunteer advisor',
  coordinator: 'Coordinator',
}
