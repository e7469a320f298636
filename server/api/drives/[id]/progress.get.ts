// Yards pledged and at the goal, day by day, from the share snapshots (coordinators).
import { driveParam } from '#shared/schemas/drives'
import { requireDrive } from '../../../services/drives'
import { cachedDriveView, driveProgress } from '../../../services/dashboard'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, driveParam)
  await requireRole(event, 'coordinator')
  return cachedDriveView(await requireDrive(id), 'progress', driveProgress)
})
