// The organisation's goal share, for anyone signed in (every score is measured against it).
import { organisationGoal } from '../../services/organisation'

export default defineEventHandler(async (event) => {
  await requireUser(event)
  return { goal: await organisationGoal() }
})
