// Coordinator CSV import, step 1: what would change and every row error (row, column, message); writes nothing.
import { planImport, readCsvUpload } from '../../../services/catalogue'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'coordinator')
  const text = await readCsvUpload(event)
  return (await planImport(text)).preview
})
