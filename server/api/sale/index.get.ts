// The shop: the current sale, its pickups and lots, filtered to a region's natives and a bed's conditions.
import { shopQuery } from '#shared/schemas/sale'
import { shop } from '../../services/sale'

export default defineEventHandler(async (event) => {
  const q = readQueryWith(event, shopQuery)
  await requireUser(event)
  return shop(q)
})
