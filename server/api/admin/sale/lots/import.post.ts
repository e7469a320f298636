// Imports a lots CSV into a sale: all rows or none, with every row error listed.
import { z } from 'zod'
import { importLots } from '../../../../services/sale'
import { readCsvUpload } from '../../../../services/catalogue'

const query = z.object({ saleId: z.coerce.number().int().positive() })

export default defineEventHandler(async (event) => {
  const q = readQueryWith(event, query)
  await requireRole(event, 'coordinator')
  return importLots(q.saleId, await readCsvUpload(event))
})
