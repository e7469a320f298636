// The coordinator's overview of a sale (the current one unless saleId says): sales, pickups, lots with stock and revenue, money by day.
import { z } from 'zod'
import { currentSale, saleById, pickupsOf, lotsOf, lotViews } from '../../../services/sale'
import { stockAndRevenue, moneyByDay } from '../../../services/sale-report'
import { seedSales } from '../../../database/schema'
import { desc } from 'drizzle-orm'

const query = z.object({ saleId: z.coerce.number().int().positive().optional() })

export default defineEventHandler(async (event) => {
  const q = readQueryWith(event, query)
  await requireRole(event, 'coordinator')
  const sales = await useDb().select().from(seedSales).orderBy(desc(seedSales.opensOn))
  const sale = q.saleId ? await saleById(q.saleId) : await currentSale()
  if (!sale) return { sales, sale: null, pickups: [], lots: [], species: [], money: null }
  const [pickups, lots, species, money] = await Promise.all([pickupsOf(sale.id), lotsOf(sale.id).then((l) => lotViews(l, sale.currency)), stockAndRevenue(sale.id), moneyByDay(sale.id)])
  return { sales, sale, pickups, lots, species, money }
})
