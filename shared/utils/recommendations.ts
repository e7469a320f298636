// Applying an advisor's recommendation to a yard document: pure, so the server's prediction, the server-side
// accept and the editor's undoable edit all make exactly the same change.
import type { YardDocument, YardPlanting } from '../schemas/yard-document'
import { isAreaPlanting } from '../schemas/yard-document'
import type { RecommendationChange } from '../schemas/advice'
import { centroid, type Ring } from './polygon'

export class RecommendationError extends Error {
  constructor(message: string, readonly field: string) { super(message) }
}

function freshId(doc: YardDocument, wanted: string): string {
  const taken = new Set([...doc.areas, ...doc.plantings, ...doc.lines].map((e) => e.id))
  if (!taken.has(wanted)) return wanted
  let n = 2
  while (taken.has(`${wanted}-${n}`)) n++
  return `${wanted}-${n}`
}

/** The document with the change made; `newId` names a planting the change adds. Throws RecommendationError. */
export function applyRecommendation(doc: YardDocument, change: RecommendationChange, newId: string): YardDocument {
  const next: YardDocument = { ...doc, areas: [...doc.areas], plantings: [...doc.plantings], lines: [...doc.lines] }
  if (change.kind === 'replace') {
    const i = next.plantings.findIndex((p) => p.id === change.plantingId)
    if (i < 0) throw new RecommendationError('That planting is no longer in the plan', 'change.plantingId')
    const old = next.plantings[i]!
    const replaced: YardPlanting = { ...old, species: change.species, cultivar: change.cultivar ?? null }
    if (change.height !== undefined) replaced.height = change.height
    if (change.spread !== undefined && !isAreaPlanting(old)) replaced.spread = change.spread
    // the old label named the old plant
    delete replaced.label
    next.plantings[i] = replaced
    return next
  }
  if (change.kind === 'add') {
    const bed = next.areas.find((a) => a.id === change.bedId && a.kind === 'bed')
    if (!bed) throw new RecommendationError('That bed is no longer in the plan', 'change.bedId')
    const [cx, cy] = change.x !== undefined && change.y !== undefined ? [change.x, change.y] : centroid(bed.points as Ring)
    next.plantings.push({
      id: freshId(next, newId), species: change.species, cultivar: change.cultivar ?? null,
      x: Math.round(cx * 1000) / 1000, y: Math.round(cy * 1000) / 1000, count: change.count, spread: change.spread, height: change.height,
    })
    return next
  }
  // a drift drawn above every other area planting, so the lawn under it stops counting
  const top = Math.max(0, ...next.plantings.filter(isAreaPlanting).map((p) => p.z ?? 0))
  next.plantings.push({ id: freshId(next, newId), species: change.species, cultivar: null, points: change.points, z: top + 1, spacing: change.spacing, height: change.height })
  return next
}

/** One line in words, for lists and mails. */
/** The longest summary a recommendation keeps (its column's length). */
export const RECOMMENDATION_SUMMARY_MAX = 400

/** One line saying what a recommendation changes, at most RECOMMENDATION_SUMMARY_MAX characters. */
export function describeRecommendation(doc: YardDocument, change: RecommendationChange): string {
  const full = describeInFull(doc, change)
  return full.length <= RECOMMENDATION_SUMMARY_MAX ? full : `${full.slice(0, RECOMMENDATION_SUMMARY_MAX - 1).replace(/[\ud800-\udbff]$/, '')}…`
}

function describeInFull(doc: YardDocument, change: RecommendationChange): string {
  const label = (id: string) => {
    const p = doc.plantings.find((x) => x.id === id)
    return p ? (p.label || p.species || 'the unidentified plant') : id
  }
  if (change.kind === 'replace') return `Replace ${label(change.plantingId)} with ${change.species}${change.cultivar ? ` '${change.cultivar}'` : ''}`
  if (change.kind === 'add') {
    const bed = doc.areas.find((a) => a.id === change.bedId)
    return `Add ${change.count} × ${change.species} in ${bed?.label || 'the bed'}`
  }
  return `Turn lawn into a drift of ${change.species}`
}
