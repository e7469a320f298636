// The signed-in user as the database has them now.
import { publicUser } from '../../services/accounts'
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  return { user: publicUser(user) }
})
