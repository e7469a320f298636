// Upload a visit photo (the visit's advisor): checked by content like a backdrop, up to 10 MB.
import { z } from 'zod'
import { randomBytes } from 'node:crypto'
import { idParam } from '#shared/schemas/common'
import { visitPhotos } from '../../../database/schema'
import { requireVisit } from '../../../services/advice'

const query = z.object({ caption: z.string().trim().max(300).default('') })

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  const { caption } = readQueryWith(event, query)
  const user = await requireUser(event)
  // access before the body: nobody else gets 10 MB parsed
  await requireVisit(user, id, 'edit')
  const { bytes } = await readUploadedFile(event)
  const contentType = checkImage(bytes)
  const storageKey = `visits/${id}/${Date.now().toString(36)}-${randomBytes(9).toString('base64url')}`
  await putUpload(storageKey, bytes, { contentType, size: bytes.length, createdAt: new Date().toISOString(), createdBy: user.id })
  const photoId = insertedId(await useDb().insert(visitPhotos).values({ visitId: id, storageKey, contentType, bytes: bytes.length, caption }).$returningId())
  setResponseStatus(event, 201)
  return { id: photoId, caption, contentType, bytes: bytes.length, url: `/api/visits/${id}/photos/${photoId}` }
})
