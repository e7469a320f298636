// Change the signed-in user's password.
import { changePassword } from '../../services/accounts'
import { changePasswordBody } from '#shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, changePasswordBody)
  const user = await requireUser(event)
  await changePassword(event, user, body.currentPassword, body.newPassword)
  return { ok: true }
})
