// Coordinators: set (or, with null, remove) a species' seed price per gram; the species must be in the catalogue.
import { seedPriceBody } from '#shared/schemas/seed'
import { setSeedPrice } from '../../services/seed-plan'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, seedPriceBody)
  const user = await requireRole(event, 'coordinator')
  return setSeedPrice(user, body)
})
