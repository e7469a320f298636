// Every state-changing request: refused when a browser sent it from another site (Origin / Sec-Fetch-Site),
// when its body is a type the route does not take (no text/plain "simple" requests), or when the body is larger
// than the route's cap, whether declared or streamed. The caps and exemptions live in server/utils/request-policy.ts.
import type { H3Event } from 'h3'
import { routePolicy, bodyKind, type RoutePolicy } from '../utils/request-policy'

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS'])

function ownOrigins(event: H3Event): Set<string> {
  const trust = !!useRuntimeConfig().trustProxy
  const origins = new Set([getRequestURL(event, { xForwardedHost: trust, xForwardedProto: trust }).origin])
  try { origins.add(new URL(useRuntimeConfig().appUrl).origin) } catch {}
  return origins
}

function refuseForeign(event: H3Event) {
  // Sec-Fetch-Site is set by every current browser and cannot be forged by a page; Origin covers older ones
  const site = getRequestHeader(event, 'sec-fetch-site')
  const origin = getRequestHeader(event, 'origin')
  const foreignSite = site !== undefined && site !== 'same-origin' && site !== 'none'
  const foreignOrigin = origin !== undefined && !ownOrigins(event).has(origin)
  if (foreignSite || foreignOrigin) throw createError({ status: 403, message: 'Requests from other sites are not accepted' })
}

// a refused body still on its way is read and dropped up to this much, so the sender can read the 413 (a
// connection closed mid-upload shows the client a broken pipe instead); past it the connection is closed
const DISCARD_LIMIT_BYTES = 16 * 1024 * 1024

function discardRest(event: H3Event, received: number) {
  const req = event.node.req
  let size = received
  req.on('data', (chunk: Buffer) => {
    size += chunk.length
    if (size > DISCARD_LIMIT_BYTES) req.destroy()
  })
  req.resume()
}

function tooLarge(policy: RoutePolicy) {
  const mb = policy.maxBytes >= 1024 * 1024 ? `${Math.round(policy.maxBytes / 1024 / 1024)} MB` : `${Math.round(policy.maxBytes / 1024)} KB`
  return createError({ status: 413, message: `The request body is larger than ${mb}`, data: { fields: { _: `At most ${mb}` } } })
}

/**
 * The body, read only when a handler asks for it (after its access check) and never past the cap: a thenable
 * h3's body readers resolve through `event._requestBody`.
 */
function cappedBody(event: H3Event, policy: RoutePolicy): PromiseLike<Buffer> {
  let reading: Promise<Buffer> | undefined
  const read = () => new Promise<Buffer>((resolve, reject) => {
    const req = event.node.req
    const chunks: Buffer[] = []
    let size = 0
    const onData = (chunk: Buffer) => {
      size += chunk.length
      if (size > policy.maxBytes) {
        req.off('data', onData)
        // the rest of the body is never kept: dropped as it comes (the connection is cut past the discard limit)
        discardRest(event, size)
        reject(tooLarge(policy))
        return
      }
      chunks.push(chunk)
    }
    req.on('data', onData)
    req.once('end', () => resolve(Buffer.concat(chunks)))
    req.once('error', reject)
  })
  return { then: (ok, fail) => (reading ??= read()).then(ok, fail) }
}

export default defineEventHandler((event) => {
  if (SAFE_METHODS.has(event.method)) return
  const policy = routePolicy(event.path)
  if (!policy.crossSite) refuseForeign(event)
  const declared = Number(getRequestHeader(event, 'content-length') ?? 0)
  const streamed = getRequestHeader(event, 'transfer-encoding') !== undefined
  if (!(declared > 0) && !streamed) return
  const kind = bodyKind(getRequestHeader(event, 'content-type'))
  const body = event as unknown as { _requestBody: PromiseLike<Buffer> }
  if (!kind || !policy.accepts.includes(kind)) {
    // refused when the handler reads it (after its access check): a route never sees a body of the wrong type
    const wanted = policy.accepts.map((k) => ({ json: 'application/json', multipart: 'multipart/form-data', csv: 'text/csv', text: 'text/plain', form: 'application/x-www-form-urlencoded' })[k]).join(' or ')
    setResponseHeader(event, 'connection', 'close')
    body._requestBody = { then: (_ok, fail) => Promise.reject(createError({ status: 415, message: `Send the body as ${wanted}` })).then(undefined, fail) }
    return
  }
  if (declared > policy.maxBytes) {
    if (declared > DISCARD_LIMIT_BYTES) setResponseHeader(event, 'connection', 'close')
    else discardRest(event, 0)
    throw tooLarge(policy)
  }
  body._requestBody = cappedBody(event, policy)
})
