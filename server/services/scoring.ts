// The server's side of scoring: load the species facts and the organisation's goal, run the engine
// (shared/utils/score) in a worker thread (./score-pool). Nothing is kept between requests.
import type { YardDocument } from '#shared/schemas/yard-document'
import type { Score, ScoreInputs } from '#shared/schemas/score'
import type { SpeciesFacts } from '#shared/types/species'
import { speciesKeys } from '#shared/utils/score'
import { nameKey } from '#shared/utils/species-name'
import { speciesFactsFor } from './catalogue'
import { organisationGoal } from './organisation'
import { scoreInWorker } from './score-pool'

/** Catalogue facts for the species `doc` names, in `region`, keyed by `nameKey`. */
export async function yardFacts(doc: YardDocument, region: string | null): Promise<Map<string, SpeciesFacts>> {
  const keys = speciesKeys(doc)
  return region && keys.size ? speciesFactsFor(keys, region) : new Map()
}

/** The score of a document, with facts from the species catalogue and the organisation's goal. */
export async function scoreDocument(doc: YardDocument, region?: string | null): Promise<Score> {
  const where = region ?? doc.region ?? null
  const [facts, goal] = await Promise.all([yardFacts(doc, where), organisationGoal()])
  return scoreInWorker({ doc, facts, goal, region: where })
}

/** The goal and the facts of `names` in `region`, as the editor's engine takes them. */
export async function scoreInputsFor(names: Iterable<string>, region: string | null): Promise<ScoreInputs> {
  const keys = new Set([...names].map(nameKey))
  const [facts, goal] = await Promise.all([region && keys.size ? speciesFactsFor(keys, region) : new Map<string, SpeciesFacts>(), organisationGoal()])
  return { region, goal, facts: Object.fromEntries(facts) }
}

/** The score inputs for a saved yard's species. */
export function yardScoreInputs(doc: YardDocument, region: string | null): Promise<ScoreInputs> {
  return scoreInputsFor(speciesKeys(doc), region ?? doc.region ?? null)
}
