// A drive's pledges by neighbourhood, small groups folded together (coordinators).
import { driveParam } from '#shared/schemas/drives'
import { requireDrive } from '../../../services/drives'
import { cachedDriveView, driveNeighbourhoods } from '../../../services/dashboard'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, driveParam)
  await requireRole(event, 'coordinator')
  return cachedDriveView(await requireDrive(id), 'neighbourhoods', driveNeighbourhoods)
})
