import { describe, it, expect, beforeEach } from 'vitest'
import { createPinia, setActivePinia } from 'pinia'
import { sampleDoc } from '../../shared/utils/yard-fixtures'
import { useEditorStore, HISTORY_LIMIT } from '../../../../app/stores/editor'


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
