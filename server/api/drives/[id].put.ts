// Change a drive (coordinators); a new goal re-derives every pledge's status.
import { idParam } from '#shared/schemas/common'
import { driveBody } from '#shared/schemas/drives'
import { updateDrive } from '../../services/drives'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, driveBody)
  await requireRole(event, 'coordinator')
  return updateDrive(id, body)
})
