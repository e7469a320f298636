// Start a pledge drive (coordinators): name, dates, goal share, which share certifies, target yards.
import { driveBody } from '#shared/schemas/drives'
import { createDrive } from '../../services/drives'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, driveBody)
  const user = await requireRole(event, 'coordinator')
  setResponseStatus(event, 201)
  return createDrive(user, body)
})
