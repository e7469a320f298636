// The anonymised table of a drive's pledged yards, sorted, filtered and paged (coordinators).
import { driveParam, pledgesQuery } from '#shared/schemas/drives'
import { requireDrive } from '../../../services/drives'
import { pledgeTable } from '../../../services/dashboard'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, driveParam)
  const query = readQueryWith(event, pledgesQuery)
  await requireRole(event, 'coordinator')
  return pledgeTable(await requireDrive(id), query)
})
