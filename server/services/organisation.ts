// The organisation running Wildward (one row): its name and the goal share every yard is scored against.
import { organisation } from '../database/schema'
import { DEFAULT_GOAL } from '#shared/utils/score/goal'

export async function ensureOrganisation() {
  const db = useDb()
  const [row] = await db.select().from(organisation).limit(1)
  if (!row) await db.insert(organisation).values({ id: 1, name: 'Our native yards group', goal: DEFAULT_GOAL }).onDuplicateKeyUpdate({ set: { id: 1 } })
}

/** The organisation's goal share (default 0.70), read fresh: a coordinator may change it at any time. */
export async function organisationGoal(): Promise<number> {
  const [row] = await useDb().select({ goal: organisation.goal }).from(organisation).limit(1)
  return row ? Number(row.goal) : DEFAULT_GOAL
}

/** Sets the goal share (validated 0.50–1.00 by the route) and answers it as stored. */
export async function setOrganisationGoal(goal: number): Promise<number> {
  await ensureOrganisation()
  await useDb().update(organisation).set({ goal })
  return organisationGoal()
}
