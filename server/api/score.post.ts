// The score of a yard document sent by the editor on every change; nothing is stored.
import { yardDocument } from '#shared/schemas/yard-document'
import { scoreDocument } from '../services/scoring'

export default defineEventHandler(async (event) => {
  // plain JSON.parse instead of readBodyWith's destr: destr rescans a 100 KB body with two regexes first, and
  // zod drops any "__proto__" key anyway
  const raw = await readRawBody(event, 'utf8')
  let body: unknown = {}
  try {
    if (raw) body = JSON.parse(raw)
  } catch {
    badRequest({ _: 'The request body is not valid JSON' })
  }
  const result = yardDocument.safeParse(body)
  if (!result.success) {
    const fields = fieldErrors(result.error)
    badRequest(fields, `Invalid body: ${Object.entries(fields).slice(0, 3).map(([k, v]) => `${k}: ${v}`).join('; ')}`)
  }
  await requireUser(event)
  return scoreDocument(result.data)
})
