// The moves to the goal as plan items: what a move replaces stays, marked to remove, with a native of the same
// layer and size to plant in its place; lawn a move converts gets a native drift to plant above it; plants a
// move adds are to plant. Pure: the editor applies the result as one undoable change.
import type { Layer, SpeciesFacts } from '../../types/species'
import type { Move } from '../../schemas/score'
import { phaseOf, type YardDocument, type YardPlanting } from '../../schemas/yard-document'
import { applyMoves } from './moves'
import { phaseView } from './phases'

/** The document with one share's moves added as plan items (the plan's yard is what the moves were worked out on). */
export function movesAsPlanItems(doc: YardDocument, facts: Map<string, SpeciesFacts>, moves: Move[], nativeFor: (layer: Layer) => string, region?: string | null): YardDocument {
  // the moves were worked out on the plan: there now and to plant
  const plan = phaseView(doc, 'planned')
  const moved = applyMoves(plan, facts, moves, nativeFor, region)
  const before = new Map(plan.plantings.map((p) => [p.id, p]))
  const taken = new Set([...doc.areas, ...doc.plantings, ...doc.lines].map((e) => e.id))
  const fresh = (id: string) => { let n = 1; let out = `${id}-plan`; while (taken.has(out)) out = `${id}-plan-${++n}`; taken.add(out); return out }
  const removing = new Set<string>()
  const added: Array<{ after: string | null; planting: YardPlanting }> = []
  for (const [i, p] of moved.plantings.entries()) {
    const old = before.get(p.id)
    if (!old) {
      // a new planting (a drift cut from lawn, plants added): to plant, after the planting it came from
      const prev = moved.plantings[i - 1]
      added.push({ after: prev?.id ?? null, planting: { ...p, id: taken.has(p.id) ? fresh(p.id) : (taken.add(p.id), p.id), phase: 'planned' } })
    } else if (old.species !== p.species) {
      // replaced: a planting there now is to remove, with its successor to plant; one only planned changes in place
      if (phaseOf(old) === 'planned') added.push({ after: null, planting: { ...p, id: old.id, phase: 'planned' } })
      else {
        removing.add(old.id)
        const successor: YardPlanting = { ...p, id: fresh(old.id), phase: 'planned' }
        delete successor.label
        delete successor.doneOn
        added.push({ after: old.id, planting: successor })
      }
    }
  }
  const out: YardDocument = { ...doc, plantings: doc.plantings.map((p) => (removing.has(p.id) ? { ...p, phase: 'removing' as const } : p)) }
  for (const { after, planting } of added) {
    const inPlace = out.plantings.findIndex((p) => p.id === planting.id)
    if (inPlace >= 0) { out.plantings[inPlace] = planting; continue }
    const at = after === null ? -1 : out.plantings.findIndex((p) => p.id === after)
    if (at >= 0) out.plantings.splice(at + 1, 0, planting)
    else out.plantings.push(planting)
  }
  return out
}
