// The score of a yard document sent by the editor on every change; nothing is stored.
import { yardDocument } from '#shared/schemas/yard-document'
import { scoreDocument } from '../services/scoring'

export default defineEventHandler(async (event) => {
  const doc = await readBodyWith(event, yardDocument)
  await requireUser(event)
  return scoreDocument(doc)
})
