import type { H3Event } from 'h3'
import type { z } from 'zod'
import { checkJsonBody, checkValue, type BodyCheck } from './json-body'

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
  return answerOf(checkValue(schema, value, prefix))
}

export async function readBodyWith<S extends z.ZodType>(event: H3Event, schema: S): Promise<z.infer<S>> {
  return answerOf(checkJsonBody(schema, await readRawBody(event, 'utf8')))
}

/** A body check's data, or the 400 naming its fields. */
export function answerOf<T>(result: BodyCheck<T>): T {
  if (!result.ok) badRequest(result.fields, result.message)
  return result.data
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
