// The pledged-yards table as CSV, with the same filters and sort (coordinators).
import { driveParam, pledgesQuery } from '#shared/schemas/drives'
import { requireDrive } from '../../../services/drives'
import { pledgeCsv } from '../../../services/dashboard'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, driveParam)
  const query = readQueryWith(event, pledgesQuery)
  await requireRole(event, 'coordinator')
  const drive = await requireDrive(id)
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="pledged-yards-drive-${drive.id}.csv"`)
  return pledgeCsv(drive, query)
})
