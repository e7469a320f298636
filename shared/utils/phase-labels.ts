// What a person reads for each phase and each view of the plan (one table for every screen).
import type { Phase } from '../schemas/yard-document'

export const PHASE_LABELS: Record<Phase, string> = { existing: 'There now', planned: 'To plant', removing: 'To remove' }
/** The short words beside a share: "16 % now → 74 % with the plan". */
export const SHARE_VIEW_LABELS = { now: 'now', planned: 'with the plan' } as const
export const PHASE_VIEW_LABELS = { now: 'Now', planned: 'With the plan', both: 'Both' } as const

/** "16.0 % now → 74.0 % with the plan" (a share of null shows as a dash). */
export function nowAndPlan(now: number | null | undefined, planned: number | null | undefined, digits = 1): string {
  const pct = (s: number | null | undefined) => (s === null || s === undefined ? '—' : `${(s * 100).toFixed(digits)} %`)
  return `${pct(now)} ${SHARE_VIEW_LABELS.now} → ${pct(planned)} ${SHARE_VIEW_LABELS.planned}`
}
