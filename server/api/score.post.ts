// The score of a posted yard document, worked out whole on every request; nothing is kept or stored.
// (The editor scores in the browser with the same engine; this is for API clients and checks.)
import { scoreDocument } from '../services/scoring'
import { readBodyInWorker } from '../services/score-pool'

export default defineEventHandler(async (event) => {
  // the session before the body: nobody signed out gets a document-sized body read
  await requireUser(event)
  const doc = await readBodyInWorker(event, 'yardDocument')
  return scoreDocument(doc)
})
