// What each route may receive: the largest body, the content types it accepts, and whether it may be called
// without a same-origin browser request (webhooks). One table, read by server/middleware/request-guard.ts.
import { MAX_DOCUMENT_BYTES } from '#shared/schemas/yard-document'
import { IMPORT_MAX_BYTES } from '#shared/schemas/species'
import { MAX_IMAGE_BYTES } from './storage'

export type BodyKind = 'json' | 'multipart' | 'csv' | 'text' | 'form'

export interface RoutePolicy {
  /** the largest request body in bytes, streamed or declared */
  maxBytes: number
  /** the body types accepted; anything else is a 415 */
  accepts: BodyKind[]
  /**
   * true for a route called by another server rather than our own pages (a payment service's signed webhook):
   * it skips the Origin / Sec-Fetch-Site check, so it MUST authenticate each request itself (a signature).
   */
  crossSite?: boolean
}

/** JSON bodies of forms and small actions. */
export const SMALL_BODY_BYTES = 64 * 1024
const MULTIPART_HEADROOM = 64 * 1024

const DEFAULT_POLICY: RoutePolicy = { maxBytes: SMALL_BODY_BYTES, accepts: ['json'] }

// first match wins; paths are matched without the query string
const POLICIES: Array<[RegExp, RoutePolicy]> = [
  [/^\/api\/score$/, { maxBytes: MAX_DOCUMENT_BYTES, accepts: ['json'] }],
  [/^\/api\/yards(\/\d+)?$/, { maxBytes: MAX_DOCUMENT_BYTES, accepts: ['json'] }],
  [/^\/api\/yards\/\d+\/backdrop$/, { maxBytes: MAX_IMAGE_BYTES + MULTIPART_HEADROOM, accepts: ['multipart'] }],
  [/^\/api\/visits\/\d+\/photos$/, { maxBytes: MAX_IMAGE_BYTES + MULTIPART_HEADROOM, accepts: ['multipart'] }],
  // a CSV file as its own body (a spreadsheet may label it text/plain); never JSON, so never a JSON route's way in
  [/^\/api\/catalogue\/import\/(preview|apply)$/, { maxBytes: IMPORT_MAX_BYTES, accepts: ['csv', 'text'] }],
  // a webhook from a hosted service: add its route here with crossSite: true (and verify its signature in the handler)
  // one-click unsubscribe (RFC 8058) is posted by the reader's mail service; the token in the link is the credential
  [/^\/seed-reminders\/unsubscribe$/, { maxBytes: 1024, accepts: ['form'], crossSite: true }],
  [/^\/api\/payments\/webhook$/, { maxBytes: SMALL_BODY_BYTES, accepts: ['json'], crossSite: true }],
]

export function routePolicy(path: string): RoutePolicy {
  const bare = path.split('?')[0]!
  for (const [pattern, policy] of POLICIES) if (pattern.test(bare)) return policy
  return DEFAULT_POLICY
}

const KIND_OF: Record<string, BodyKind> = {
  'application/json': 'json',
  'multipart/form-data': 'multipart',
  'text/csv': 'csv',
  'text/plain': 'text',
  'application/x-www-form-urlencoded': 'form',
}

/** The body kind a Content-Type header names, or null for anything no route accepts. */
export function bodyKind(contentType: string | undefined): BodyKind | null {
  const type = (contentType ?? '').split(';')[0]!.trim().toLowerCase()
  return KIND_OF[type] ?? null
}
