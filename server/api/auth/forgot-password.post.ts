// Ask for a password-reset link by e-mail; the answer does not reveal whether the account exists.
import { requestPasswordReset } from '../../services/accounts'
import { forgotPasswordBody } from '#shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const { email } = await readBodyWith(event, forgotPasswordBody)
  await requestPasswordReset(email)
  return { ok: true, message: 'If an account uses that e-mail, a reset link is on its way.' }
})
