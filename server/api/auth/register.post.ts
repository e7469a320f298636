// Create an account (role homeowner) and sign it in.
import { register, startSession, publicUser } from '../../services/accounts'
import { registerBody } from '#shared/schemas/auth'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, registerBody)
  const user = await register(body)
  await startSession(event, user)
  setResponseStatus(event, 201)
  return { user: publicUser(user) }
})
