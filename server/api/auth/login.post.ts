// Sign in with e-mail and password (throttled per e-mail and per address).
import { signIn, startSession, publicUser } from '../../services/accounts'
import { loginBody } from '#shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const { email, password } = await readBodyWith(event, loginBody)
  const user = await signIn(event, email, password)
  await startSession(event, user)
  return { user: publicUser(user) }
})
