// Send a reminder or thank-you to a drive's pledgers in bulk, through the job table (coordinators).
import { driveParam, mailingBody } from '#shared/schemas/drives'
import { requireDrive, createMailing } from '../../../services/drives'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, driveParam)
  const body = await readBodyWith(event, mailingBody)
  const user = await requireRole(event, 'coordinator')
  setResponseStatus(event, 202)
  return createMailing(user, await requireDrive(id), body)
})
