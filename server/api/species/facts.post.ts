// Facts of species named in a yard, for scoring in the browser: after a region change or for a name not seen yet.
import { speciesFactsBody } from '#shared/schemas/score'
import { scoreInputsFor } from '../../services/scoring'

export default defineEventHandler(async (event) => {
  const body = await readBodyWith(event, speciesFactsBody)
  await requireUser(event)
  return scoreInputsFor(body.names, body.region)
})
