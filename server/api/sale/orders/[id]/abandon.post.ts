// The buyer came back from the hosted checkout without paying: the session ends and the order returns to the cart.
import { idParam } from '#shared/schemas/common'
import { requireOrderAccess, abandonCheckout, orderView } from '../../../../services/sale-orders'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const user = await requireUser(event)
  const order = await requireOrderAccess(user, id)
  if (order.userId !== user.id) throw createError({ status: 403, message: 'Only the buyer may leave their checkout' })
  await abandonCheckout(order)
  return orderView(await requireOrderAccess(user, id))
})
