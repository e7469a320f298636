// Compresses what the server renders or answers (pages, JSON, calendars) over a size, per request: brotli when the
// browser takes it, else gzip. Built assets come precompressed from the build (nitro.compressPublicAssets).
import { brotliCompressSync, gzipSync, constants } from 'node:zlib'
import { appendResponseHeader, getRequestHeader, getResponseHeader, removeResponseHeader, setResponseHeader, type H3Event } from 'h3'
import { chooseEncoding, isCompressible, COMPRESS_MIN_BYTES } from '../utils/compression'

function addVary(event: H3Event) {
  const vary = String(getResponseHeader(event, 'Vary') ?? '')
  if (!/accept-encoding/i.test(vary)) appendResponseHeader(event, 'Vary', 'Accept-Encoding')
}

export default defineNitroPlugin((nitroApp) => {
  nitroApp.hooks.hook('beforeResponse', (event, response) => {
    const res = event.node.res
    if (res.headersSent || event.method === 'HEAD' || response.body instanceof Error) return
    // an in-process request (the error page, server-side fetches) is read back as text by the caller
    if ((event.node.req as { __unenv__?: unknown }).__unenv__ || getRequestHeader(event, 'x-nuxt-error')) return
    const type = String(getResponseHeader(event, 'Content-Type') ?? '')
    // a precompressed public asset: the other variants exist too, so caches must key on the encoding
    if (getResponseHeader(event, 'Content-Encoding')) { addVary(event); return }
    let body = response.body
    const json = body !== null && typeof body === 'object' && !Buffer.isBuffer(body) && !(body instanceof Uint8Array) && typeof (body as { pipe?: unknown }).pipe !== 'function' && !(body instanceof ReadableStream)
    if (json && !type) {
      // h3 would serialise it the same way; doing it here lets the bytes be measured and compressed
      body = JSON.stringify(body)
      setResponseHeader(event, 'Content-Type', 'application/json')
    }
    const contentType = String(getResponseHeader(event, 'Content-Type') ?? (typeof body === 'string' ? 'text/html' : ''))
    if (!isCompressible(contentType) || res.statusCode === 204 || res.statusCode === 304) return
    if (typeof body !== 'string' && !Buffer.isBuffer(body)) return
    addVary(event)
    const bytes = Buffer.isBuffer(body) ? body : Buffer.from(body)
    if (bytes.length < COMPRESS_MIN_BYTES) { if (json) response.body = body; return }
    const encoding = chooseEncoding(String(getRequestHeader(event, 'accept-encoding') ?? ''))
    if (!encoding) { if (json) response.body = body; return }
    // brotli level 4: close to gzip's speed at a smaller size, which suits answers made per request
    response.body = encoding === 'br'
      ? brotliCompressSync(bytes, { params: { [constants.BROTLI_PARAM_QUALITY]: 4, [constants.BROTLI_PARAM_SIZE_HINT]: bytes.length } })
      : gzipSync(bytes, { level: 6 })
    setResponseHeader(event, 'Content-Encoding', encoding)
    removeResponseHeader(event, 'Content-Length')
  })
})
