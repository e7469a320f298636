// The yard now and with the plan, and growth over time (shared/utils/score, growth.ts).
import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { scoreYard, YEARS_TO_MATURITY, grownSize } from '#shared/utils/score'
import { yardDocument, YARD_FORMAT } from '#shared/schemas/yard-document'
import type { SpeciesFacts } from '#shared/types/species'
import { FIXTURE_FACTS, facts, rect, yard, randomYards } from './fixtures'

// an invented rapid-growing native perennial, mature spread 0.6 m and height 1 m
const RAPID: SpeciesFacts = { scientificName: 'Rudbeckia hirta', commonName: null, layer: 'ground', status: 'native', spread: 0.6, height: 1, spacing: 0.45, lawn: false, growthRate: 'rapid', estimated: [], toxic: false }
const withRapid = () => facts([...FIXTURE_FACTS, RAPID])

describe('shares now and with the plan', () => {
  const doc = yard({
    plantings: [
      { id: 'lawn', species: 'Festuca arundinacea', z: 0, points: rect(0, 0, 10, 10), spacing: null, height: 0.1 },
      { id: 'drift', species: 'Carex pensylvanica', z: 1, points: rect(0, 0, 5, 10), spacing: 0.3, height: 0.2, phase: 'planned' },
      { id: 'barberry', species: 'Berberis thunbergii', x: 7.5, y: 5, count: 1, spread: 1, height: 1, phase: 'removing' },
    ],
  })
  const score = scoreYard(doc, facts(), 0.7)

  it('now counts what is there and what is to go; the plan what is there and what is to come', () => {
    // now: 100 m² of lawn and a barberry disc of π·0.5² m², nothing native (hand-worked)
    expect(score.now.area.native).toBe(0)
    expect(score.now.area.total).toBeCloseTo(100 + Math.PI * 0.25, 3)
    expect(score.now.count.share).toBe(0)
    // with the plan: the drift covers half the lawn, the barberry is gone: 50 / 100 (hand-worked)
    expect(score.planned.area.share).toBeCloseTo(0.5, 9)
    expect(score.planned.count.share).toBe(1)
    // the top-level shares stay the plan's, so existing callers read the plan
    expect(score.shares).toEqual(score.planned)
  })

  it('lists the plantings to remove with their status', () => {
    expect(score.plantings.find((p) => p.id === 'barberry')).toMatchObject({ status: 'invasive', count: 1 })
    expect(score.plantings.map((p) => p.id).sort()).toEqual(['barberry', 'drift', 'lawn'])
  })

  it('a yard without phases is all there now: now equals the plan', () => {
    const plain = scoreYard(yard({ plantings: [{ id: 'oak', species: 'Quercus alba', x: 5, y: 5, count: 1, spread: 4, height: 10 }] }), facts(), 0.7)
    expect(plain.now).toEqual(plain.planned)
  })

  it('now ≤ the plan when the plan only adds native plants', () => {
    fc.assert(fc.property(randomYards(), fc.array(fc.record({ x: fc.double({ min: 0, max: 6, noNaN: true }), y: fc.double({ min: 0, max: 6, noNaN: true }), species: fc.constantFrom('Quercus alba', 'Cornus sericea', 'Echinacea purpurea') }), { minLength: 1, maxLength: 5 }), ({ doc, goal }, adds) => {
      const planned = { ...doc, plantings: [...doc.plantings, ...adds.map((a, i) => ({ id: `new${i}`, ...a, count: 1, phase: 'planned' as const }))] }
      const s = scoreYard(planned, facts(), goal)
      for (const k of ['count', 'area', 'volume'] as const) {
        if (s.now[k].share === null) continue
        expect(s.planned[k].share!).toBeGreaterThanOrEqual(s.now[k].share! - 1e-9)
      }
    }), { numRuns: 60 })
  })
})

describe('growth over time', () => {
  const plug = (years: number | null, phase: 'planned' | 'existing' = 'planned') => scoreYard(yard({
    plantings: [
      { id: 'r', species: 'Rudbeckia hirta', x: 5, y: 5, count: 1, start: 'plug', phase },
      { id: 'hosta', species: 'Hosta plantaginea', x: 2, y: 2, count: 1, spread: 0.8, height: 0.5 },
    ],
  }), withRapid(), 0.7, undefined, undefined, { years })

  it('a plug of a rapid perennial reaches its mature spread in 2 years', () => {
    // common practice ("sleep, creep, leap"): a fast perennial fills out in its second year, a typical one in its third
    expect(YEARS_TO_MATURITY.ground.rapid).toBe(2)
    const native = (s: ReturnType<typeof plug>) => s.planned.area.native
    // mature: a disc 0.6 m across, π·0.3² = 0.2827 m² (hand-worked)
    expect(native(plug(2))).toBeCloseTo(Math.PI * 0.09, 3)
    expect(native(plug(null))).toBeCloseTo(Math.PI * 0.09, 3)
    // year 1: halfway from a 5 cm plug (from memory) to 0.6 m: 0.325 m across, π·0.1625² = 0.0830 m²
    expect(native(plug(1))).toBeCloseTo(Math.PI * 0.1625 ** 2, 3)
    // at planting: the plug, π·0.025² m²
    expect(native(plug(0))).toBeCloseTo(Math.PI * 0.025 ** 2, 4)
  })

  it('the count share does not change with time; the cover share grows', () => {
    const steps = [0, 1, 3, 5, null].map((y) => plug(y))
    for (const s of steps) expect(s.planned.count.share).toBe(0.5)
    const covers = steps.map((s) => s.planned.area.share!)
    for (let i = 1; i < covers.length; i++) expect(covers[i]!).toBeGreaterThanOrEqual(covers[i - 1]!)
    expect(covers[0]).toBeLessThan(covers[4]!)
  })

  it('only plantings to plant grow: what stands there now is full size', () => {
    expect(plug(0, 'existing').planned.area.native).toBeCloseTo(Math.PI * 0.09, 3)
  })

  it('a drift covers its outline at maturity, and its plants’ share of it before', () => {
    const drift = (years: number | null) => scoreYard(yard({ plantings: [{ id: 'd', species: 'Rudbeckia hirta', z: 1, points: rect(0, 0, 4, 4), spacing: 0.45, phase: 'planned' }] }), withRapid(), 0.7, undefined, undefined, { years }).planned.area.native
    expect(drift(null)).toBeCloseTo(16, 6)
    // year 1: (0.325 / 0.6)² of 16 m² = 4.694 m² (hand-worked)
    expect(drift(1)).toBeCloseTo(16 * (0.325 / 0.6) ** 2, 3)
  })

  it('a species without a growth rate takes the layer’s middle value, marked estimated', () => {
    const g = grownSize({ start: 'pot' }, 'shrub', null, { spread: 2, height: 2 }, 3)
    // common practice: a typical shrub fills out in about 6 years; a 1-gallon pot is about 25 cm across (from memory)
    expect(g).toMatchObject({ estimated: true, years: 6, fraction: 0.5 })
    expect(g.spread).toBeCloseTo(0.25 + (2 - 0.25) / 2, 9)
    const s = scoreYard(yard({ plantings: [{ id: 'c', species: 'Cornus sericea', x: 5, y: 5, count: 1, phase: 'planned' }] }), facts(), 0.7, undefined, undefined, { years: 1 })
    expect(s.warnings.map((w) => w.message).join()).toMatch(/no growth rate/)
  })
})

describe('the yard format', () => {
  it('reads a /1 document as everything there now and writes /2', () => {
    const parsed = yardDocument.parse({ format: 'wildward.yard/1', plantings: [{ id: 'p', species: 'Quercus alba', x: 1, y: 1 }] })
    expect(parsed.format).toBe(YARD_FORMAT)
    expect(YARD_FORMAT).toBe('wildward.yard/2')
    expect(parsed.plantings[0]!.phase).toBeUndefined()
    const s = scoreYard({ ...parsed, region: 'US-OH' }, facts(), 0.7)
    expect(s.now).toEqual(s.planned)
  })

  it('refuses an unknown phase and names the field', () => {
    const r = yardDocument.safeParse({ plantings: [{ id: 'p', species: null, x: 1, y: 1, phase: 'someday' }] })
    expect(r.success).toBe(false)
    expect(r.error!.issues[0]!.path).toEqual(['plantings', 0, 'phase'])
  })

  it('keeps phases and sizes at planting through the fast path', () => {
    const d = yardDocument.parse({ format: 'wildward.yard/2', areas: [{ id: 'a', kind: 'bed', points: rect(0, 0, 1, 1), phase: 'planned' }], plantings: [{ id: 'p', species: null, x: 1, y: 1, phase: 'removing', start: 'plug', startSpread: 0.1, doneOn: '2026-05-01' }] })
    expect(d.areas[0]!.phase).toBe('planned')
    expect(d.plantings[0]).toMatchObject({ phase: 'removing', start: 'plug', startSpread: 0.1, doneOn: '2026-05-01' })
  })
})

describe('moves as plan items', () => {
  it('marks replaced plantings to remove with a native successor to plant, and the plan then meets the goal', async () => {
    const { movesAsPlanItems } = await import('#shared/utils/score')
    const { NATIVE_FOR } = await import('./fixtures')
    const doc = yard({ plantings: [
      { id: 'oak', species: 'Quercus alba', x: 3, y: 3, count: 1, spread: 2, height: 5 },
      { id: 'barberry', species: 'Berberis thunbergii', x: 7, y: 7, count: 4, spread: 1, height: 1 },
    ] })
    const score = scoreYard(doc, facts(), 0.7)
    const moves = score.moves.filter((m) => m.share === 'count')
    expect(moves[0]).toMatchObject({ kind: 'replace-invasive' })
    const planned = movesAsPlanItems(doc, facts(), moves, (l) => NATIVE_FOR[l])
    expect(planned.plantings.find((p) => p.id === 'barberry')).toMatchObject({ species: 'Berberis thunbergii', phase: 'removing' })
    expect(planned.plantings.find((p) => p.id === 'barberry-plan')).toMatchObject({ species: 'Cornus sericea', phase: 'planned', x: 7, y: 7, count: 4 })
    const after = scoreYard(planned, facts(), 0.7)
    // now: 1 native of 5 plants; with the plan: 5 of 5 (hand-worked)
    expect(after.now.count.share).toBeCloseTo(0.2, 9)
    expect(after.planned.count.share).toBe(1)
  })
})
