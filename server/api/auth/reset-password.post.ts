// Choose a new password with a single-use, expiring link from the reset e-mail.
import { resetPassword, startSession, publicUser } from '../../services/accounts'
import { resetPasswordBody } from '#shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const { token, password } = await readBodyWith(event, resetPasswordBody)
  const user = await resetPassword(token, password)
  await startSession(event, user)
  return { user: publicUser(user) }
})
