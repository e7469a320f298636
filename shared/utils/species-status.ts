// One vocabulary for a species' status in a region, and the one order search and tables rank it by: the
// region's natives first, then what is recorded there, then the rest. Every screen shows these words.
import type { RegionStatus } from '../types/species'
import { regionName } from './regions'

const WORDS: Record<Exclude<RegionStatus, 'absent'>, string> = {
  native: 'native',
  nativeAndIntroduced: 'native and introduced — does not count as native',
  introduced: 'introduced',
  invasive: 'invasive',
}

/** The status in words, lower case: `native` … `not recorded in Ohio` (`not recorded here` without a region). */
export function statusWords(status: RegionStatus, region?: string | null): string {
  return status === 'absent' ? `not recorded in ${region ? regionName(region) : 'this state or province'}` : WORDS[status]
}

/** The same words starting with a capital, for a badge or a cell on its own. */
export function statusLabel(status: RegionStatus, region?: string | null): string {
  const w = statusWords(status, region)
  return w.charAt(0).toUpperCase() + w.slice(1)
}

/** A shorter form where space is tight; the full words go in its title. */
export function statusShortLabel(status: RegionStatus): string {
  return status === 'absent' ? 'Not recorded' : status === 'nativeAndIntroduced' ? 'Native and introduced' : statusLabel(status)
}

/** Rank group: 0 native in the region, 1 recorded there (also native and introduced, introduced, invasive), 2 not recorded. */
export function statusGroup(status: RegionStatus | undefined): 0 | 1 | 2 {
  return status === 'native' ? 0 : status && status !== 'absent' ? 1 : 2
}

/** Statuses in the order the status column sorts by (the order of the words above). */
export const STATUS_ORDER: Record<RegionStatus, number> = { native: 0, nativeAndIntroduced: 1, introduced: 2, invasive: 3, absent: 4 }

