import { describe, it, expect } from 'vitest'
import fc from 'fast-check'
import { scoreYard } from '#shared/utils/score'
import { applyMoves } from '#shared/utils/score/moves'
import type { ShareKind } from '#shared/schemas/score'
import { facts, rect, yard, randomYards, NATIVE_FOR } from './fixtures'

const nativeFor = (layer: keyof typeof NATIVE_FOR) => NATIVE_FOR[layer]
const movesFor = (s: ReturnType<typeof scoreYard>, share: ShareKind) => s.moves.filter((m) => m.share === share)

describe('moves to the goal', () => {
  it('adds k ≥ (g·t − n)/(1 − g) native plants for the count', () => {
    const plantings = Array.from({ length: 10 }, (_, i) => ({ id: `p${i}`, species: i < 5 ? 'Cornus sericea' : 'Acer platanoides', x: 1 + (i % 5) * 2, y: i < 5 ? 3 : 7, count: 1, spread: 1, height: 1 }))
    const score = scoreYard(yard({ plantings }), facts(), 0.7)
    // product brief, "To the goal": k ≥ (0.7·10 − 5)/(1 − 0.7) = 6.67 → 7; 12/17 = 0.706 meets, 11/16 = 0.6875 would not
    expect(movesFor(score, 'count')).toEqual([{ share: 'count', kind: 'add-plants', amount: 7, unit: 'plants', text: expect.stringMatching(/^Add 7 native/) }])
  })

  it('converts A ≥ g·T − N m² of lawn for the cover, and the matching area for the volume', () => {
    const doc = yard({
      areas: [{ id: 'bed', kind: 'bed', z: 5, points: rect(0, 0, 2, 5) }],
      plantings: [
        { id: 'lawn', species: 'Festuca arundinacea', z: 0, points: rect(0, 0, 10, 10), spacing: null, height: 0.1 },
        { id: 'sedge', species: 'Carex pensylvanica', z: 5, points: rect(0, 0, 2, 5), spacing: 0.3, height: 0.2 },
      ],
    })
    const score = scoreYard(doc, facts(), 0.7)
    // cover: T = 90 lawn + 10 sedge, N = 10 → A ≥ 0.7·100 − 10 = 60 m² (product brief, "To the goal")
    expect(movesFor(score, 'area')).toEqual([{ share: 'area', kind: 'convert-lawn', amount: 60, unit: 'm2', text: 'Turn 60 m² of lawn into a native drift' }])
    // volume: T = 9 + 2, N = 2; a drift 0.6 m tall replacing lawn 0.1 m tall: (2 + 0.6A) ≥ 0.7(11 + 0.5A) → A ≥ 5.7/0.25 = 22.8 (hand-worked)
    expect(movesFor(score, 'volume')).toMatchObject([{ kind: 'convert-lawn', amount: 22.8, unit: 'm2' }])
    expect(movesFor(score, 'count')).toEqual([])
    for (const share of ['area', 'volume'] as const) {
      const after = scoreYard(applyMoves(doc, facts(), movesFor(score, share), nativeFor), facts(), 0.7)
      expect(after.shares[share].share!).toBeGreaterThanOrEqual(0.7 - 1e-9)
    }
  })

  it('replaces invasive plantings first, the largest first, and stops when the goal is met', () => {
    const doc = yard({ plantings: [
      ...Array.from({ length: 4 }, (_, i) => ({ id: `dogwood${i}`, species: 'Cornus sericea', x: 2 + i * 2, y: 2, count: 1, spread: 1, height: 1 })),
      { id: 'honeysuckle', species: 'Lonicera maackii', x: 5, y: 6, count: 2, spread: 1, height: 1 },
      { id: 'barberry', species: 'Berberis thunbergii', x: 8, y: 8, count: 1, spread: 1, height: 1 },
    ] })
    const score = scoreYard(doc, facts(), 0.7)
    // count: 4 of 7 native; replacing the 2 honeysuckles gives 6/7 = 0.857 ≥ 0.7, so the barberry is not needed
    expect(movesFor(score, 'count')).toEqual([{ share: 'count', kind: 'replace-invasive', amount: 2, unit: 'plants', text: expect.stringMatching(/Replace the 2 Lonicera maackii \(invasive in Ohio\)/) }])
  })

  it('bring every share to at least the goal when applied, over random yards', () => {
    const yards = randomYards()
    const applied = new Set<string>()
    fc.assert(fc.property(yards, ({ doc, goal }) => {
      const score = scoreYard(doc, facts(), goal)
      for (const share of ['count', 'area', 'volume'] as const) {
        const moves = movesFor(score, share)
        const before = score.shares[share].share
        if (!moves.length) {
          expect(before === null || before >= goal - 1e-9, `${share} below the goal with no moves`).toBe(true)
          continue
        }
        for (const m of moves) applied.add(`${share}:${m.kind}`)
        const after = scoreYard(applyMoves(doc, facts(), moves, nativeFor), facts(), goal).shares[share].share
        expect(after, `${share}: ${JSON.stringify(moves)}`).not.toBeNull()
        expect(after!).toBeGreaterThanOrEqual(goal - 1e-9)
      }
    }), { numRuns: 150 })
    // the random yards exercise every kind of move on every share it applies to
    expect([...applied].sort()).toEqual(['area:add-plants', 'area:convert-lawn', 'area:replace-invasive', 'count:add-plants', 'count:replace-invasive', 'volume:add-plants', 'volume:convert-lawn', 'volume:replace-invasive'])
  }, 60_000)
})
