// Uploaded files through Nitro's storage layer: the filesystem under runtimeConfig.uploadDir by default, or an
// S3-compatible bucket (uploadDriver = 's3', uploadS3.*), so several app instances can share uploads.
import type { Storage } from 'unstorage'
import { join, resolve } from 'node:path'

export const MAX_IMAGE_BYTES = 10 * 1024 * 1024
export type ImageType = 'image/png' | 'image/jpeg' | 'image/webp'

let mounted: Promise<Storage> | null = null

/** The uploads storage, mounted on first use from the runtime config. */
export function useUploads(): Promise<Storage> {
  mounted ??= (async () => {
    const config = useRuntimeConfig()
    const storage = useStorage()
    if (config.uploadDriver === 's3') {
      const { default: s3Driver } = await import('unstorage/drivers/s3')
      const s3 = config.uploadS3 as { endpoint: string; region: string; bucket: string; accessKeyId: string; secretAccessKey: string }
      storage.mount('uploads', s3Driver({ endpoint: s3.endpoint, region: s3.region || 'auto', bucket: s3.bucket, accessKeyId: s3.accessKeyId, secretAccessKey: s3.secretAccessKey }))
    } else {
      const { default: fsDriver } = await import('unstorage/drivers/fs')
      storage.mount('uploads', fsDriver({ base: resolve(config.uploadDir || join('.data', 'uploads')) }))
    }
    return storage
  })()
  return mounted
}

/**
 * What an image really is, from its first bytes (never from its name or declared type):
 * PNG 89 50 4E 47 0D 0A 1A 0A; JPEG FF D8 FF; WebP "RIFF" ···· "WEBP". Null for anything else.
 */
export function sniffImageType(bytes: Uint8Array): ImageType | null {
  const at = (i: number, ...b: number[]) => b.every((v, j) => bytes[i + j] === v)
  if (bytes.length >= 8 && at(0, 0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a)) return 'image/png'
  if (bytes.length >= 3 && at(0, 0xff, 0xd8, 0xff)) return 'image/jpeg'
  if (bytes.length >= 12 && at(0, 0x52, 0x49, 0x46, 0x46) && at(8, 0x57, 0x45, 0x42, 0x50)) return 'image/webp'
  return null
}

/** The type of an uploaded image, or a 400/413 in our one error shape naming the field. */
export function checkImage(bytes: Uint8Array, field = 'file'): ImageType {
  if (bytes.length > MAX_IMAGE_BYTES) {
    throw createError({ status: 413, message: 'The image is larger than 10 MB', data: { fields: { [field]: 'The image is larger than 10 MB' } } })
  }
  const type = sniffImageType(bytes)
  if (!type) {
    const message = 'That file is not a PNG, JPEG or WebP image (its contents were checked, not its name)'
    throw createError({ status: 400, message, data: { fields: { [field]: message } } })
  }
  return type
}

/** The one file part of a multipart upload, refusing bodies over the limit before reading them. */
export async function readUploadedFile(event: Parameters<typeof readMultipartFormData>[0], field = 'file') {
  const length = Number(getRequestHeader(event, 'content-length') ?? 0)
  // a little headroom for the multipart boundaries and headers
  if (length > MAX_IMAGE_BYTES + 64 * 1024) {
    throw createError({ status: 413, message: 'The image is larger than 10 MB', data: { fields: { [field]: 'The image is larger than 10 MB' } } })
  }
  // h3 answers nothing for a body that is not multipart: say which type the upload must be
  if (!(getRequestHeader(event, 'content-type') ?? '').toLowerCase().startsWith('multipart/form-data')) {
    throw createError({ status: 415, message: 'Send the upload as multipart/form-data', data: { fields: { [field]: 'Choose an image to upload' } } })
  }
  const parts = await readMultipartFormData(event)
  const part = parts?.find((p) => p.name === field && p.filename !== undefined)
  if (!part) throw createError({ status: 400, message: 'Choose an image to upload', data: { fields: { [field]: 'Choose an image to upload' } } })
  return { bytes: new Uint8Array(part.data.buffer, part.data.byteOffset, part.data.byteLength), filename: part.filename ?? '' }
}

export interface StoredFile { contentType: string; size: number; createdAt: string; createdBy: number }

export async function putUpload(key: string, bytes: Uint8Array, meta: StoredFile) {
  const storage = await useUploads()
  await storage.setItemRaw(`uploads:${key}`, Buffer.from(bytes))
  await storage.setItem(`uploads:${key}.meta.json`, meta)
}

export async function getUpload(key: string): Promise<{ bytes: Buffer; meta: StoredFile } | null> {
  const storage = await useUploads()
  const meta = await storage.getItem<StoredFile>(`uploads:${key}.meta.json`)
  if (!meta) return null
  const raw = await storage.getItemRaw(`uploads:${key}`)
  if (!raw) return null
  return { bytes: Buffer.isBuffer(raw) ? raw : Buffer.from(raw as Uint8Array), meta }
}
