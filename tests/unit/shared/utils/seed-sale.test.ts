// Packets that cover a seed plan: packets = ceil(seeds needed ÷ seeds per packet); expected values worked by hand.
import { describe, it, expect } from 'vitest'
import { packetsForPlan, bloomWords, saleIsOpen, seedsInPacket } from '#shared/utils/seed-sale'

const lot = (id: number, speciesKey: string, seedsPerPacket: number | null, stock = 10, packetMilligrams: number | null = null) => ({ id, speciesKey, seedsPerPacket, packetMilligrams, stock })

describe('packetsForPlan', () => {
  it('rounds up per species and lists species without a lot', () => {
    const { picks, missing } = packetsForPlan([
      { key: 'asclepias tuberosa', scientificName: 'Asclepias tuberosa', seeds: 120, grams: 0.7 },
      { key: 'echinacea purpurea', scientificName: 'Echinacea purpurea', seeds: 100, grams: 0.4 },
      { key: 'carex pensylvanica', scientificName: 'Carex pensylvanica', seeds: 30, grams: null },
    ], [lot(1, 'asclepias tuberosa', 50), lot(2, 'echinacea purpurea', 100)])
    // 120 ÷ 50 = 2.4 → 3 packets; 100 ÷ 100 = 1 exactly → 1 packet
    expect(picks).toEqual([
      { lotId: 1, key: 'asclepias tuberosa', scientificName: 'Asclepias tuberosa', packets: 3 },
      { lotId: 2, key: 'echinacea purpurea', scientificName: 'Echinacea purpurea', packets: 1 },
    ])
    expect(missing).toEqual(['Carex pensylvanica'])
  })

  it('uses grams for a lot sold by weight and prefers the lot with most stock', () => {
    const { picks } = packetsForPlan(
      [{ key: 'rudbeckia hirta', scientificName: 'Rudbeckia hirta', seeds: 400, grams: 1.3 }],
      [lot(5, 'rudbeckia hirta', null, 2, 500), lot(6, 'rudbeckia hirta', null, 9, 500)],
    )
    // 1.3 g ÷ 0.5 g = 2.6 → 3 packets, from lot 6 (9 in stock beats 2)
    expect(picks).toEqual([{ lotId: 6, key: 'rudbeckia hirta', scientificName: 'Rudbeckia hirta', packets: 3 }])
  })

  it('a weight lot cannot cover a species whose seed weight is unknown; species needing no seed are skipped', () => {
    const { picks, missing } = packetsForPlan([
      { key: 'a', scientificName: 'A a', seeds: 10, grams: null },
      { key: 'b', scientificName: 'B b', seeds: 0, grams: 0 },
    ], [lot(1, 'a', null, 5, 100), lot(2, 'b', 10)])
    expect(picks).toEqual([])
    expect(missing).toEqual(['A a'])
  })
})

describe('lot words', () => {
  it('bloom months as runs', () => {
    expect(bloomWords([6, 7, 8])).toBe('Jun–Aug')
    expect(bloomWords([4, 6])).toBe('Apr, Jun')
    expect(bloomWords([])).toBe('')
  })
  it('seeds in a packet sold by weight', () => {
    // 1 g of seed at 453,592 seeds a pound: 453,592 ÷ 453.59237 g ≈ 1,000 seeds a gram → 1,000 (by hand)
    expect(seedsInPacket({ seedsPerPacket: null, packetMilligrams: 1000 }, 453_592.37)).toBe(1000)
    expect(seedsInPacket({ seedsPerPacket: 40, packetMilligrams: null }, null)).toBe(40)
  })
  it('a sale is open between its dates unless paused', () => {
    const sale = { opensOn: '2026-03-01', closesOn: '2026-04-30', paused: false }
    expect(saleIsOpen(sale, '2026-03-01')).toBe(true)
    expect(saleIsOpen(sale, '2026-04-30')).toBe(true)
    expect(saleIsOpen(sale, '2026-05-01')).toBe(false)
    expect(saleIsOpen({ ...sale, paused: true }, '2026-03-15')).toBe(false)
  })
})
