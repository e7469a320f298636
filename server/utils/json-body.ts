// Checking a JSON body against a zod schema, as a value: pure, so a worker thread can run it on a
// document-sized body (server/services/score-pool.ts) and the server turns the result into its answer.
import type { z } from 'zod'

export type BodyCheck<T> = { ok: true; data: T } | { ok: false; fields: Record<string, string>; message?: string }

/** Turns zod issues into `{ "plantings.3.points": "…" }`, the `fields` of our one error shape. */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {}
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_'
    fields[key] ??= issue.message
  }
  return fields
}

/** The value checked against the schema: its data, or the fields at fault and a message naming them. */
export function checkValue<S extends z.ZodType>(schema: S, value: unknown, prefix: string): BodyCheck<z.infer<S>> {
  const result = schema.safeParse(value)
  if (result.success) return { ok: true, data: result.data }
  const fields = fieldErrors(result.error)
  return { ok: false, fields, message: `Invalid ${prefix}: ${Object.entries(fields).slice(0, 3).map(([k, v]) => `${k === '_' ? prefix : k}: ${v}`).join('; ')}` }
}

const ESCAPED_SURROGATE = /\\u[dD][89a-fA-F]/

/** A raw JSON body parsed and checked against the schema. */
export function checkJsonBody<S extends z.ZodType>(schema: S, raw: string | undefined): BodyCheck<z.infer<S>> {
  // plain JSON.parse rather than h3's readBody: its destr rescans large bodies (a 100 KB yard) with regexes
  // first, and our bodies are always JSON; zod drops any "__proto__" key
  let body: unknown = {}
  try {
    if (raw) body = JSON.parse(raw)
  } catch {
    return { ok: false, fields: { _: 'The request body is not valid JSON' } }
  }
  // a lone UTF-16 surrogate can only come in as a \u escape: look for one only then
  if (raw && ESCAPED_SURROGATE.test(raw)) {
    const path = illFormedStringPath(body)
    if (path) return { ok: false, fields: { [path]: 'Contains a broken character (a lone UTF-16 surrogate)' } }
  }
  return checkValue(schema, body ?? {}, 'body')
}

/** The path of the first string (value or key) that is not well-formed Unicode, or null. */
export function illFormedStringPath(value: unknown, path: string[] = []): string | null {
  if (typeof value === 'string') return value.isWellFormed() ? null : (path.join('.') || '_')
  if (Array.isArray(value)) {
    for (let i = 0; i < value.length; i++) {
      const found = illFormedStringPath(value[i], [...path, String(i)])
      if (found) return found
    }
  } else if (value && typeof value === 'object') {
    for (const [k, v] of Object.entries(value)) {
      if (!k.isWellFormed()) return [...path, '_'].join('.')
      const found = illFormedStringPath(v, [...path, k])
      if (found) return found
    }
  }
  return null
}
