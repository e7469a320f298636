// Remove a visit photo (the visit's advisor, while the request is open).
import { and, eq } from 'drizzle-orm'
import { visitChildParam } from '#shared/schemas/advice'
import { visitPhotos } from '../../../../database/schema'
import { requireVisit } from '../../../../services/advice'

export default defineEventHandler(async (event) => {
  const { id, childId } = readParamsWith(event, visitChildParam)
  const user = await requireUser(event)
  await requireVisit(user, id, 'edit')
  const db = useDb()
  const [photo] = await db.select().from(visitPhotos).where(and(eq(visitPhotos.id, childId), eq(visitPhotos.visitId, id))).limit(1)
  if (!photo) throw createError({ status: 404, message: 'No such photo' })
  await db.delete(visitPhotos).where(eq(visitPhotos.id, photo.id))
  const uploads = await useUploads()
  await Promise.all([uploads.removeItem(`uploads:${photo.storageKey}`), uploads.removeItem(`uploads:${photo.storageKey}.meta.json`)])
  setResponseStatus(event, 204)
  return null
})
