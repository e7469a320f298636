// Coordinators: set the organisation's goal share (0.50–1.00); every score after this uses it.
import { organisationGoalBody } from '#shared/schemas/score'
import { setOrganisationGoal } from '../../services/organisation'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, organisationGoalBody)
  await requireRole(event, 'coordinator')
  return { goal: await setOrganisationGoal(body.goal) }
})
