// Coordinators: the seed sale's prices per gram.
import { asc } from 'drizzle-orm'
import { seedPrices } from '../../database/schema'

export default defineEventHandler(async (event) => {
  await requireRole(event, 'coordinator')
  const rows = await useDb().select({ scientificName: seedPrices.scientificName, pricePerGram: seedPrices.pricePerGram, updatedAt: seedPrices.updatedAt })
    .from(seedPrices).orderBy(asc(seedPrices.scientificName))
  return { items: rows.map((r) => ({ ...r, pricePerGram: Number(r.pricePerGram) })) }
})
