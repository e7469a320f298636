// One bulk mail's progress, for the progress bar to poll (coordinators).
import { driveMailingParam } from '#shared/schemas/drives'
import { requireDrive, mailingView } from '../../../../services/drives'

export default defineEventHandler(async (event) => {
  const { id, mailingId } = readParamsWith(event, driveMailingParam)
  await requireRole(event, 'coordinator')
  return mailingView(await requireDrive(id), mailingId)
})
