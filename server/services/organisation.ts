import { organisation } from '../database/schema'

export const DEFAULT_GOAL = 0.7

export async function ensureOrganisation() {
  const db = useDb()
  const [row] = await db.select().from(organisation).limit(1)
  if (!row) await db.insert(organisation).values({ id: 1, name: 'Our native yards group', goal: DEFAULT_GOAL }).onDuplicateKeyUpdate({ set: { id: 1 } })
}

// the editor re-scores on every change and the goal almost never changes (there is no route that sets it), so
// each instance re-reads it at most every few seconds
const GOAL_TTL_MS = 5_000
let goalCache: { goal: number; until: number } | null = null

/** The organisation's goal share (default 0.70). */
export async function organisationGoal(): Promise<number> {
  if (goalCache && goalCache.until > Date.now()) return goalCache.goal
  // while the database is unreachable the last goal read keeps scoring going
  const [row] = await useDb().select({ goal: organisation.goal }).from(organisation).limit(1)
    .catch((e) => { if (goalCache && isDatabaseUnreachable(e)) return [{ goal: goalCache.goal }]; throw e })
  const goal = row ? Number(row.goal) : DEFAULT_GOAL
  goalCache = { goal, until: Date.now() + GOAL_TTL_MS }
  return goal
}
