// Upload a backdrop image (photo or site plan) for a yard; checked by content, up to 10 MB.
import { randomBytes } from 'node:crypto'
import { idParam } from '#shared/schemas/common'

export default defineEventHandler(async (event) => {
  const { id } = readParamsWith(event, idParam)
  // access before the body: nobody without edit rights gets 10 MB parsed
  const { user } = await requireYardAccess(event, id, 'edit')
  const { bytes } = await readUploadedFile(event)
  const contentType = checkImage(bytes)
  const uploadId = `${Date.now().toString(36)}-${randomBytes(9).toString('base64url')}`
  await putUpload(`backdrops/${id}/${uploadId}`, bytes, { contentType, size: bytes.length, createdAt: new Date().toISOString(), createdBy: user.id })
  setResponseStatus(event, 201)
  return { uploadId, contentType, size: bytes.length, url: `/api/yards/${id}/backdrop/${uploadId}` }
})
