// Where a species fact comes from, in the few words a gardener reads beside it: a USDA PLANTS record, an
// estimate (with its rule), or the organization's own list. The catalogue stores a fuller `source` per fact.
import { RANGE_ESTIMATE } from './region-zones'

export type SourceKind = 'usda' | 'estimated' | 'organization' | 'unknown'

export function sourceKind(source: string | null | undefined): SourceKind {
  const s = (source ?? '').trim().toLowerCase()
  if (!s) return 'unknown'
  if (s.startsWith('estimated') || s.startsWith('from memory')) return 'estimated'
  if (s.startsWith('coordinator')) return 'organization'
  if (s.startsWith('usda')) return 'usda'
  return 'organization'
}

/** `USDA PLANTS` · `estimated from its native range` · `estimated` · `your organization's list` · `not recorded`. */
export function sourceLabel(source: string | null | undefined): string {
  switch (sourceKind(source)) {
    case 'usda': return 'USDA PLANTS'
    case 'estimated': return (source ?? '').startsWith(RANGE_ESTIMATE) ? RANGE_ESTIMATE : 'estimated'
    case 'organization': return "your organization's list"
    default: return 'not recorded'
  }
}

/** The rule behind an estimate, without its leading word: `estimated: typical ground height` → `typical ground height`. */
export function sourceDetail(source: string | null | undefined): string | null {
  const m = /^(?:estimated(?: from its native range)?|coordinator)\s*[:(]\s*(.+?)\)?$/i.exec((source ?? '').trim())
  return m ? m[1]! : null
}
