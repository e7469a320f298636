// A visit photo's bytes, for anyone who may see the visit.
import { and, eq } from 'drizzle-orm'
import { visitChildParam } from '#shared/schemas/advice'
import { visitPhotos } from '../../../../database/schema'
import { requireVisit } from '../../../../services/advice'

export default defineEventHandler(async (event) => {
  const { id, childId } = readParamsWith(event, visitChildParam)
  const user = await requireUser(event)
  await requireVisit(user, id)
  const [photo] = await useDb().select().from(visitPhotos).where(and(eq(visitPhotos.id, childId), eq(visitPhotos.visitId, id))).limit(1)
  const file = photo ? await getUpload(photo.storageKey) : null
  if (!file) throw createError({ status: 404, message: 'No such photo' })
  setResponseHeaders(event, {
    'content-type': file.meta.contentType,
    'content-length': file.bytes.length,
    'cache-control': 'private, max-age=86400, immutable',
    'x-content-type-options': 'nosniff',
    'content-security-policy': "default-src 'none'",
  })
  return file.bytes
})
