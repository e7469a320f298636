import { describe, it, expect, beforeEach } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { emptyYardDocument, type YardDocument } from '#shared/schemas/yard-document'
import { useEditorStore, HISTORY_LIMIT } from '../../../../app/stores/editor'

function sampleDoc(): YardDocument {
  return emptyYardDocument({
    boundary: [[0, 0], [20, 0], [20, 10], [0, 10]],
    areas: [
      { id: 'house', kind: 'building', z: 3, points: [[1, 1], [5, 1], [5, 4], [1, 4]] },
      { id: 'bed', kind: 'bed', z: 2, points: [[8, 2], [12, 2], [12, 6], [8, 6]] },
    ],
    plantings: [
      { id: 'lawn', species: 'Poa pratensis', z: 1, points: [[0, 0], [20, 0], [20, 10], [0, 10]], spacing: null },
      { id: 'oak', species: 'Quercus alba', x: 15, y: 5, count: 1, spread: 6 },
      { id: 'aster', species: 'Symphyotrichum novae-angliae', x: 10, y: 4, count: 4, spread: 0.5 },
    ],
    lines: [{ id: 'wire', kind: 'overhead', points: [[0, 9], [20, 9]] }],
  })
}

describe('the store: one change action, undo and redo', () => {
  beforeEach(() => setActivePinia(createPinia()))
  const load = () => {
    const s = useEditorStore()
    s.load({ id: 1, name: 'Y', region: 'US-OH', access: 'owner', version: 3, document: sampleDoc() })
    return s
  }

  it('records a labelled change and undoes and redoes it', () => {
    const s = load()
    const before = s.revision
    expect(s.applyChange('Rename the bed', (d) => { d.areas[1]!.label = 'Pollinator bed' })).toBe(true)
    expect(s.revision).toBe(before + 1)
    expect(s.undoLabel).toBe('Rename the bed')
    expect(s.undo()).toBe('Rename the bed')
    expect(s.doc.areas[1]!.label).toBeUndefined()
    expect(s.redo()).toBe('Rename the bed')
    expect(s.doc.areas[1]!.label).toBe('Pollinator bed')
  })
  it('cancels a change that returns false, and restores the document when one throws', () => {
    const s = load()
    expect(s.applyChange('Nothing', (d) => { d.plantings = []; return false })).toBe(false)
    expect(s.doc.plantings).toHaveLength(3)
    expect(() => s.applyChange('Broken', (d) => { d.areas = []; throw new Error('boom') })).toThrow('boom')
    expect(s.doc.areas).toHaveLength(2)
    expect(s.canUndo).toBe(false)
  })
  it('clears redo on a new change and caps the history', () => {
    const s = load()
    s.nudgeSelected(1, 0)
    s.select(['oak'])
    for (let i = 0; i < HISTORY_LIMIT + 10; i++) s.nudgeSelected(0.1, 0)
    expect(s.past).toHaveLength(HISTORY_LIMIT)
    s.undo()
    expect(s.canRedo).toBe(true)
    s.nudgeSelected(0.1, 0)
    expect(s.canRedo).toBe(false)
  })
  it('refuses every change for a viewer', () => {
    const s = useEditorStore()
    s.load({ id: 1, name: 'Y', region: 'US-OH', access: 'view', version: 1, document: sampleDoc() })
    s.select(['oak'])
    s.deleteSelected()
    expect(s.doc.plantings).toHaveLength(3)
    expect(s.canUndo).toBe(false)
  })
  it('adds, duplicates and deletes through the same action, keeping the selection sensible', () => {
    const s = load()
    const id = s.addPlanting({ species: null, x: 1, y: 1, count: 1, spread: 1 })
    expect(s.selection).toEqual([id])
    s.duplicateSelected()
    expect(s.selection).toHaveLength(1)
    expect(s.selection[0]).not.toBe(id)
    s.deleteSelected()
    expect(s.selection).toEqual([])
    expect(s.doc.plantings).toHaveLength(4)
    s.undo()
    expect(s.doc.plantings).toHaveLength(5)
  })
})
