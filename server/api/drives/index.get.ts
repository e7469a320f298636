// Every pledge drive, newest first, for coordinators.
import { listDrives } from '../../services/drives'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'coordinator')
  return { items: await listDrives() }
})
