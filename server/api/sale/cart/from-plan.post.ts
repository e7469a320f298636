// Puts in the cart the packets that cover a yard's seed plan; says which species have no lot.
import { cartFromPlanBody } from '#shared/schemas/sale'
import { cartFromPlan } from '../../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, cartFromPlanBody)
  await requireRole(event, 'homeowner', 'coordinator')
  const { user, yard } = await requireYardAccess(event, body.yardId, 'view')
  return cartFromPlan(user, yard)
})
