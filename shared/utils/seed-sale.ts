// The seed sale's pure rules: which packets cover a seed plan, what a lot grows, its treatment in words.
import { GRAMS_PER_POUND } from './seed-size'

export interface PlanNeed { key: string; scientificName: string; seeds: number; grams: number | null }
export interface LotOffer { id: number; speciesKey: string; seedsPerPacket: number | null; packetMilligrams: number | null; stock: number }

export interface PacketPick { lotId: number; key: string; scientificName: string; packets: number }

/**
 * Packets that cover a plan: packets = ceil(seeds needed ÷ seeds per packet) for each species that has a lot
 * (by weight when a lot is sold by weight: ceil(grams needed ÷ grams per packet)). A species with several lots
 * takes the one with most stock. Species with no lot, or whose lots cannot say how much seed they hold, are listed.
 */
export function packetsForPlan(needs: PlanNeed[], lots: LotOffer[]): { picks: PacketPick[]; missing: string[] } {
  const picks: PacketPick[] = []
  const missing: string[] = []
  for (const need of needs) {
    if (need.seeds <= 0) continue
    const candidates = lots.filter((l) => l.speciesKey === need.key).sort((a, b) => b.stock - a.stock || a.id - b.id)
    let packets: number | null = null
    let lotId = 0
    for (const lot of candidates) {
      if (lot.seedsPerPacket) packets = Math.ceil(need.seeds / lot.seedsPerPacket)
      else if (lot.packetMilligrams && need.grams !== null) packets = Math.ceil((need.grams * 1000) / lot.packetMilligrams)
      if (packets !== null) { lotId = lot.id; break }
    }
    if (packets === null) missing.push(need.scientificName)
    else picks.push({ lotId, key: need.key, scientificName: need.scientificName, packets: Math.max(1, packets) })
  }
  return { picks, missing }
}

/** Seeds in a packet sold by weight, from the catalogue's seeds per pound (null when either is unknown). */
export function seedsInPacket(lot: Pick<LotOffer, 'seedsPerPacket' | 'packetMilligrams'>, seedsPerPound: number | null): number | null {
  if (lot.seedsPerPacket) return lot.seedsPerPacket
  if (!lot.packetMilligrams || !seedsPerPound) return null
  return Math.floor((lot.packetMilligrams / 1000) * seedsPerPound / GRAMS_PER_POUND)
}

/** "about 250 seeds" or "0.5 g" for a packet. */
export function packetContents(lot: Pick<LotOffer, 'seedsPerPacket' | 'packetMilligrams'>): string {
  if (lot.seedsPerPacket) return `${lot.seedsPerPacket} seeds`
  if (lot.packetMilligrams) return `${(lot.packetMilligrams / 1000).toLocaleString('en-US', { maximumFractionDigits: 3 })} g`
  return 'one packet'
}

const MONTHS = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec']

/** "Jun–Aug" from [6, 7, 8]; "Apr, Jun" for gaps; "" when unknown. */
export function bloomWords(months: number[]): string {
  const sorted = [...new Set(months)].filter((m) => m >= 1 && m <= 12).sort((a, b) => a - b)
  const runs: string[] = []
  for (let i = 0; i < sorted.length;) {
    let j = i
    while (j + 1 < sorted.length && sorted[j + 1] === sorted[j]! + 1) j++
    runs.push(i === j ? MONTHS[sorted[i]! - 1]! : `${MONTHS[sorted[i]! - 1]}–${MONTHS[sorted[j]! - 1]}`)
    i = j + 1
  }
  return runs.join(', ')
}

/** Is a sale open on a day (YYYY-MM-DD)? */
export function saleIsOpen(sale: { opensOn: string; closesOn: string; paused: boolean }, today: string): boolean {
  return !sale.paused && sale.opensOn <= today && today <= sale.closesOn
}
