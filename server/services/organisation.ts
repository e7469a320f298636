import { organisation } from '../database/schema'

export const DEFAULT_GOAL = 0.7

export async function ensureOrganisation() {
  const db = useDb()
  const [row] = await db.select().from(organisation).limit(1)
  if (!row) await db.insert(organisation).values({ id: 1, name: 'Our native yards group', goal: DEFAULT_GOAL }).onDuplicateKeyUpdate({ set: { id: 1 } })
}

/** The organisation's goal share (default 0.70). */
export async function organisationGoal(): Promise<number> {
  const [row] = await useDb().select({ goal: organisation.goal }).from(organisation).limit(1)
  return row ? Number(row.goal) : DEFAULT_GOAL
}
