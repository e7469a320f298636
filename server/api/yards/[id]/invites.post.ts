// Invite someone by e-mail to view or edit a yard (the owner only); the link arrives by mail.
import { idParam } from '#shared/schemas/common'
import { inviteBody } from '#shared/schemas/advice'
import { createInvite } from '../../../services/sharing'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const body = await readBodyWith(event, inviteBody)
  const { user, yard } = await requireYardAccess(event, id, 'owner')
  const invite = await createInvite(user, yard, body)
  setResponseStatus(event, 201)
  return { id: invite.id, email: body.email, role: body.role, status: 'pending' }
})
