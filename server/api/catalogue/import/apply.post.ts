// Coordinator CSV import, step 2: checks the file again and applies it all in one transaction, or nothing (400).
import { applyImport, readCsvUpload } from '../../../services/catalogue'

export default defineEventHandler(async (event) => {
  const user = await requireRole(event, 'coordinator')
  const text = await readCsvUpload(event)
  const result = await applyImport(text, user.id)
  if (!result.applied) {
    const first = result.preview.errors[0]
    throw createError({
      status: 400,
      message: `Nothing was changed: ${result.preview.errorCount} row error${result.preview.errorCount === 1 ? '' : 's'}${first ? ` (row ${first.row}, ${first.column || 'file'}: ${first.message})` : ''}`,
      data: { errors: result.preview.errors, errorCount: result.preview.errorCount, fields: { file: 'Fix the rows listed and upload again' } },
    })
  }
  return { changeCount: result.preview.changeCount, newSpecies: result.preview.newSpecies, rows: result.preview.rows }
})
