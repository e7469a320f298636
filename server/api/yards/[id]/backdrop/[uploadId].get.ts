// A yard's backdrop image, for anyone who may view the yard.
import { z } from 'zod'

const params = z.object({ id: z.coerce.number().int().positive(), uploadId: z.string().regex(/^[a-z0-9]+-[A-Za-z0-9_-]{12}$/) })

export default defineEventHandler(async (event) => {
  const { id, uploadId } = readParamsWith(event, params)
  await requireYardAccess(event, id, 'view')
  const file = await getUpload(`backdrops/${id}/${uploadId}`)
  if (!file) throw createError({ status: 404, message: 'No such image' })
  setResponseHeaders(event, {
    'content-type': file.meta.contentType,
    'content-length': file.bytes.length,
    // private: the image is only for people with access; an upload id never changes its bytes
    'cache-control': 'private, max-age=86400, immutable',
    'x-content-type-options': 'nosniff',
    'content-security-policy': "default-src 'none'",
  })
  return file.bytes
})
