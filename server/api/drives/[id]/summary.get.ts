// A drive's totals against its target and the histogram of certifying shares (coordinators; `current` works).
import { driveParam } from '#shared/schemas/drives'
import { requireDrive } from '../../../services/drives'
import { cachedDriveView, driveSummary } from '../../../services/dashboard'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, driveParam)
  await requireRole(event, 'coordinator')
  return cachedDriveView(await requireDrive(id), 'summary', driveSummary)
})
