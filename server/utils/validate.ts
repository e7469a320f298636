import type { H3Event } from 'h3'
import type { z } from 'zod'

/** Turns zod issues into `{ "plantings.3.points": "…" }`, the `fields` of our one error shape. */
export function fieldErrors(error: z.ZodError): Record<string, string> {
  const fields: Record<string, string> = {}
  for (const issue of error.issues) {
    const key = issue.path.length ? issue.path.join('.') : '_'
    fields[key] ??= issue.message
  }
  return fields
}

export function badRequest(fields: Record<string, string>, message?: string): never {
  throw invalidInput(fields, message)
}

/** The 400 that badRequest throws, for `throw invalidInput(…)` where control flow must see the throw. */
export function invalidInput(fields: Record<string, string>, message?: string, status = 400) {
  const first = Object.entries(fields)[0]
  return createError({
    status,
    message: message ?? (first ? `${first[0] === '_' ? 'Input' : first[0]}: ${first[1]}` : 'Invalid input'),
    data: { fields },
  })
}

function check<S extends z.ZodType>(schema: S, value: unknown, prefix: string): z.infer<S> {
  const result = schema.safeParse(value)
  if (!result.success) {
    const fields = fieldErrors(result.error)
    badRequest(fields, `Invalid ${prefix}: ${Object.entries(fields).slice(0, 3).map(([k, v]) => `${k === '_' ? prefix : k}: ${v}`).join('; ')}`)
  }
  return result.data
}

export async function readBodyWith<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  // plain JSON.parse rather than h3's readBody: its destr rescans large bodies (a 100 KB yard) with regexes
  // first, and our bodies are always JSON; zod drops any "__proto__" key
  const raw = await readRawBody(event, 'utf8')
  let body: unknown = {}
  try {
    if (raw) body = JSON.parse(raw)
  } catch {
    badRequest({ _: 'The request body is not valid JSON' })
  }
  // a lone UTF-16 surrogate can only come in as a \u escape: look for one only then
  if (raw && ESCAPED_SURROGATE.test(raw)) {
    const path = illFormedStringPath(body)
    if (path) badRequest({ [path]: 'Contains a broken character (a lone UTF-16 surrogate)' })
  }
  return check(schema, body ?? {}, 'body')
}

const ESCAPED_SURROGATE = /\\u[dD][89a-fA-F]/

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

export function readQueryWith<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  return check(schema, getQuery(event), 'query')
}

export function readParamsWith<S extends z.ZodType>(event: H3Event, schema: S): z.infer<S> {
  const result = schema.safeParse(getRouterParams(event, { decode: true }))
  // a malformed id cannot name anything that exists
  if (!result.success) throw createError({ status: 404, message: 'Not found' })
  return result.data
}
