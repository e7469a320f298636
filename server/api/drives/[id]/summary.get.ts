// A drive's totals against its target and the histogram of certifying shares (coordinators; `current` works).
import { driveParam } from '#shared/schemas/drives'
import { cachedDriveSummary } from '../../../services/dashboard'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, driveParam)
  await requireRole(event, 'coordinator')
  return cachedDriveSummary(id)
})
