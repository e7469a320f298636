// The yard as it is now and with the plan: which areas and plantings each view holds.
import { phaseOf, type YardDocument } from '../../schemas/yard-document'

/** The yard as it is now (there now + to remove) or with the plan (there now + to plant). */
export function phaseView(doc: YardDocument, view: 'now' | 'planned'): YardDocument {
  const skip = view === 'now' ? 'planned' : 'removing'
  return { ...doc, areas: doc.areas.filter((a) => phaseOf(a) !== skip), plantings: doc.plantings.filter((p) => phaseOf(p) !== skip) }
}

/** Whether anything in the yard is to plant or to remove (else now and the plan are the same yard). */
export const hasPlan = (doc: YardDocument) => doc.areas.some((a) => phaseOf(a) !== 'existing') || doc.plantings.some((p) => phaseOf(p) !== 'existing')
