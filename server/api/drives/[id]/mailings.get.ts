// A drive's recent bulk mails with their progress (coordinators).
import { driveParam } from '#shared/schemas/drives'
import { requireDrive, listMailings } from '../../../services/drives'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, driveParam)
  await requireRole(event, 'coordinator')
  return { items: await listMailings(await requireDrive(id)) }
})
