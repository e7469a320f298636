import { describe, it, expect } from 'vitest'
import { createScoreMemo, DEFAULT_GOAL, meetsGoal, scoreYard } from '#shared/utils/score'
import { scoreSchema } from '#shared/schemas/score'
import { TRIANGULAR_FACTOR } from '#shared/utils/plant-count'
import fc from 'fast-check'
import { facts, rect, yard, randomYards, randomEdits, mutateEdit } from './fixtures'

// A hand-worked yard: a 10 × 10 m lot of lawn, a 4 × 5 m bed drawn above it holding a sedge drift at 0.5 m
// spacing, and a native tree 4 m across standing over the lawn.
const handWorked = () => yard({
  areas: [{ id: 'bed', kind: 'bed', z: 5, points: rect(1, 1, 4, 5) }],
  plantings: [
    { id: 'lawn', species: 'Poa pratensis', z: 0, points: rect(0, 0, 10, 10), spacing: null, height: 0.1 },
    { id: 'sedge', species: 'Carex pensylvanica', z: 5, points: rect(1, 1, 4, 5), spacing: 0.5, height: 0.2 },
    { id: 'oak', species: 'Quercus alba', x: 7, y: 7, count: 1, spread: 4, height: 10 },
  ],
})

describe('scoreYard', () => {
  it('gives the three shares of a hand-worked yard', () => {
    const score = scoreYard(handWorked(), facts(), 0.7)
    expect(scoreSchema.parse(score)).toEqual(score)
    const sedgePlants = Math.ceil(20 / (TRIANGULAR_FACTOR * 0.25)) // n = area / (0.866 s²), product brief: 92.4 → 93
    expect(sedgePlants).toBe(93)
    // count: lawn is sodded (no plant count) and left out; 93 sedges + 1 oak, all native
    expect(score.shares.count).toEqual({ native: 94, total: 94, share: 1 })
    // cover: lawn 100 − 20 under the bed = 80, sedge 20, oak π·2² = 12.566 (hand-worked)
    const oak = Math.PI * 4
    expect(score.shares.area.native).toBeCloseTo(20 + oak, 3)
    expect(score.shares.area.total).toBeCloseTo(80 + 20 + oak, 3)
    expect(score.shares.area.share).toBeCloseTo((20 + oak) / (100 + oak), 9)
    // volume: footprint × height: 80·0.1 + 20·0.2 + 12.566·10
    expect(score.shares.volume.share).toBeCloseTo((4 + oak * 10) / (8 + 4 + oak * 10), 9)
    expect(score.byStatus.nativeAndIntroduced).toEqual({ count: 0, area: 80, volume: 8 })
  })

  it('does not count lawn drawn under a bed, and counts a tree over the lawn in both layers', () => {
    const score = scoreYard(handWorked(), facts(), 0.7)
    const byId = Object.fromEntries(score.plantings.map((p) => [p.id, p]))
    expect(byId.lawn).toMatchObject({ layer: 'ground', area: 80, count: null }) // 100 − 20 m² under the bed
    expect(byId.oak).toMatchObject({ layer: 'tree', area: 12.566 }) // the lawn under the oak stays in the lawn's 80
    // a bed with nothing planted adds no cover; lawn drawn above a bed covers it
    const lawnOnTop = yard({ areas: [{ id: 'bed', kind: 'bed', z: 0, points: rect(1, 1, 4, 5) }], plantings: [{ id: 'lawn', species: 'Poa pratensis', z: 1, points: rect(0, 0, 10, 10), spacing: null, height: 0.1 }] })
    expect(scoreYard(lawnOnTop, facts(), 0.7).shares.area.total).toBe(100)
    // paving and a building drawn above cut it too; a later drift at the same z covers the lawn under it
    const cut = yard({
      areas: [{ id: 'house', kind: 'building', z: 10, points: rect(0, 0, 5, 5) }, { id: 'walk', kind: 'paving', z: 9, points: rect(5, 0, 1, 10) }],
      plantings: [
        { id: 'lawn', species: 'Poa pratensis', z: 0, points: rect(0, 0, 10, 10), spacing: null, height: 0.1 },
        { id: 'drift', species: 'Carex pensylvanica', z: 0, points: rect(8, 8, 2, 2), spacing: 0.3, height: 0.2 },
      ],
    })
    const s = scoreYard(cut, facts(), 0.7).plantings
    expect(s.find((p) => p.id === 'lawn')!.area).toBeCloseTo(100 - 25 - 10 - 4, 9) // hand-worked
    expect(s.find((p) => p.id === 'drift')!.area).toBe(4)
  })

  it('takes a lawn drawn without a height as mown, marked as a default', () => {
    const doc = yard({ plantings: [{ id: 'lawn', species: 'Poa pratensis', z: 0, points: rect(0, 0, 10, 10), spacing: null }] })
    const score = scoreYard(doc, facts(), 0.7)
    // 100 m² mown to 8 cm (common practice: lawns are mown to about 5–10 cm), not the fixture's grass height
    expect(score.plantings[0]!.volume).toBeCloseTo(8, 9)
    expect(score.warnings.find((w) => w.id === 'lawn')?.message).toMatch(/mown lawn, 8 cm tall \(a default\)/)
    // a height drawn with the lawn wins
    const tall = yard({ plantings: [{ ...doc.plantings[0]!, height: 0.3 }] })
    expect(scoreYard(tall, facts(), 0.7).plantings[0]!.volume).toBeCloseTo(30, 9)
  })

  it('cuts the lawn under a clump of perennials, as under a drift', () => {
    // a 10 × 10 m lawn with 4 coneflowers 0.5 m across at (5, 5): one disc of radius 0.25·√4 = 0.5 m, π/4 = 0.785 m²
    const doc = yard({ plantings: [
      { id: 'lawn', species: 'Poa pratensis', z: 0, points: rect(0, 0, 10, 10), spacing: null, height: 0.1 },
      { id: 'cone', species: 'Echinacea purpurea', x: 5, y: 5, count: 4, spread: 0.5, height: 0.9 },
    ] })
    const score = scoreYard(doc, facts(), 0.7)
    const byId = Object.fromEntries(score.plantings.map((p) => [p.id, p]))
    const disc = Math.PI * 0.5 ** 2 // hand-worked
    expect(byId.cone!.area).toBeCloseTo(disc, 3)
    expect(byId.lawn!.area).toBeCloseTo(100 - disc, 3)
    // cover counted once: lawn and clump make up the 100 m² lot
    expect(score.shares.area.total).toBeCloseTo(100, 3)
    expect(score.shares.area.share).toBeCloseTo(disc / 100, 4)
    // a shrub (not the ground layer) stands over the lawn and cuts nothing: both layers count
    const shrub = yard({ plantings: [doc.plantings[0]!, { id: 'dogwood', species: 'Cornus sericea', x: 5, y: 5, count: 1, spread: 2, height: 2 }] })
    expect(scoreYard(shrub, facts(), 0.7).shares.area.total).toBeCloseTo(100 + Math.PI, 3)
    // a clump half off the lot's edge cuts only the lawn inside: 100 − π·0.5²/2
    const edge = yard({ plantings: [doc.plantings[0]!, { ...doc.plantings[1]!, x: 0 }] as typeof doc.plantings })
    expect(scoreYard(edge, facts(), 0.7).plantings[0]!.area).toBeCloseTo(100 - disc / 2, 3)
  })

  it('reports each status on its own line, and warns about unlisted and absent species', () => {
    const doc = yard({
      plantings: [
        { id: 'p1', species: 'Cornus sericea', x: 2, y: 2, count: 2, spread: 1, height: 1 },
        { id: 'p2', species: 'Berberis thunbergii', x: 4, y: 2, count: 1, spread: 1, height: 1 },
        { id: 'p3', species: null, x: 6, y: 2, count: 1, spread: 1, height: 1 },
        { id: 'p4', species: 'Plantago imaginaria', x: 8, y: 2, count: 1, spread: 1, height: 1 },
        { id: 'p5', species: 'Yucca brevifolia', x: 2, y: 6, count: 1, spread: 1, height: 1 },
        { id: 'p6', species: '  ECHINACEA purpurea ', cultivar: 'Dusk Ember', x: 6, y: 6, count: 3, spread: 0.5, height: 0.9 },
      ],
    })
    const score = scoreYard(doc, facts(), 0.7)
    const status = Object.fromEntries(score.plantings.map((p) => [p.id, p.status]))
    expect(status).toEqual({ p1: 'native', p2: 'invasive', p3: 'unknown', p4: 'unknown', p5: 'introduced', p6: 'native' })
    expect(score.warnings.find((w) => w.id === 'p4')!.message).toMatch(/not in the species catalogue/)
    expect(score.warnings.find((w) => w.id === 'p5')!.message).toMatch(/not recorded in Ohio/)
    expect(score.warnings.some((w) => w.id === 'p3')).toBe(false)
    expect(score.byStatus.unknown.count).toBe(2)
    // a cultivar of a native counts as native and is flagged; the straight-species share leaves it out
    expect(score.plantings.find((p) => p.id === 'p6')!.cultivar).toBe(true)
    expect(score.shares.count).toMatchObject({ native: 5, total: 9 })
    expect(score.straightSpecies.count).toMatchObject({ native: 2, total: 9 })
  })

  it('counts "native and introduced" species as not native', () => {
    const doc = yard({ plantings: [{ id: 'lawn', species: 'Poa pratensis', points: rect(0, 0, 10, 10), spacing: null, height: 0.1 }] })
    const score = scoreYard(doc, facts(), 0.7)
    expect(score.shares.area).toEqual({ native: 0, total: 100, share: 0 })
    expect(score.byStatus.nativeAndIntroduced.area).toBe(100)
  })

  it('gives a null share when there is nothing to share', () => {
    const score = scoreYard(yard({}), facts(), 0.7)
    expect(score.shares).toEqual({ count: { native: 0, total: 0, share: null }, area: { native: 0, total: 0, share: null }, volume: { native: 0, total: 0, share: null } })
    expect(score.moves).toEqual([])
  })

  it('meets the goal when the share is exactly at it', () => {
    // 7 native and 3 introduced plants of one size: every share is 7/10 = 0.70, and 0.7 · 10 is 7.000000000000001 in floating point
    const plantings = Array.from({ length: 10 }, (_, i) => ({
      id: `p${i}`, species: i < 7 ? 'Cornus sericea' : 'Acer platanoides', x: 1 + (i % 5) * 2, y: i < 5 ? 3 : 7, count: 1, spread: 1, height: 1,
    }))
    const score = scoreYard(yard({ plantings }), facts(), 0.7)
    expect(score.shares.count.share).toBe(0.7)
    expect(score.shares.area.share).toBeCloseTo(0.7, 12)
    expect(score.moves).toEqual([])
  })

  it('clips footprints to the lot and leaves plants outside it uncounted', () => {
    const doc = yard({ plantings: [
      { id: 'edge', species: 'Quercus alba', x: 0, y: 5, count: 1, spread: 4, height: 10 },
      { id: 'out', species: 'Cornus sericea', x: 20, y: 5, count: 2, spread: 1, height: 1 },
    ] })
    const score = scoreYard(doc, facts(), 0.7)
    const edge = score.plantings.find((p) => p.id === 'edge')!
    // centred on the lot line: exactly half of π·2², to the answer's rounding (0.001 m²)
    expect(edge.area).toBeCloseTo(2 * Math.PI, 3)
    expect(score.plantings.find((p) => p.id === 'out')).toMatchObject({ count: 0, area: 0 })
    expect(score.warnings.find((w) => w.id === 'out')!.message).toMatch(/outside the lot/)
  })

  it('uses the catalogue sizes when the planting gives none', () => {
    const doc = yard({ plantings: [{ id: 'p1', species: 'Cornus sericea', x: 5, y: 5 }] })
    // Cornus sericea fixture: spread 2 m, height 2 m → π m², 2π m³
    expect(scoreYard(doc, facts(), 0.7).plantings[0]).toMatchObject({ count: 1, area: 3.142, volume: 6.283 })
  })
})

describe('the default goal', () => {
  it('is 0.70', () => {
    // Narango, Tallamy & Marra 2018, PNAS 115(45):11549–11554: yards under 70 % native plant biomass did not
    // sustain breeding chickadees; the organisation's goal defaults to it
    expect(DEFAULT_GOAL).toBe(0.7)
  })
})

describe('re-scoring after edits made in place (the editor)', () => {
  it('reuses per-planting results and still gives exactly a fresh score (random yards and edits)', () => {
    const wire = <T>(v: T): T => JSON.parse(JSON.stringify(v))
    fc.assert(fc.property(randomYards(), randomEdits(8), ({ doc, goal }, edits) => {
      const memo = createScoreMemo()
      const live = wire(doc)
      scoreYard(live, facts(), goal, null, memo)
      for (const [i, e] of edits.entries()) {
        mutateEdit(live, e, i)
        // reference: the same document scored from scratch, sharing nothing
        expect(scoreYard(live, facts(), goal, null, memo)).toEqual(scoreYard(wire(live), facts(), goal))
      }
    }), { numRuns: 150 })
  }, 60_000)
})

describe('meetsGoal', () => {
  it('is true at the goal, and for a share a floating-point hair below it', () => {
    // 0.7 × 3 = 2.0999999999999996 in IEEE doubles, so 2.1 / 3 = 0.7000000000000001 and 0.7·3/3 can land under 0.7
    expect(meetsGoal(0.7, 0.7)).toBe(true)
    expect(meetsGoal(0.7 - 1e-12, 0.7)).toBe(true)
    expect(meetsGoal(0.699, 0.7)).toBe(false)
    expect(meetsGoal(null, 0.7)).toBe(false)
  })
})
