/**
 * The yard editor's state: the document being edited, the selection, and the undo/redo history.
 *
 * API for other features (advisor recommendations, swaps, imports …): every change to the document goes
 * through ONE action, so it is undoable, autosaved and re-scored like a hand edit:
 *
 *   const editor = useEditorStore()
 *   editor.applyChange('Swap Norway maple for red maple', (doc) => {
 *     const p = doc.plantings.find((x) => x.id === 'p7')
 *     if (!p) return false          // returning false cancels: nothing is recorded
 *     p.species = 'Acer rubrum'
 *   }, { select: ['p7'] })          // optional: the selection after the change
 *
 *   editor.undo() / editor.redo()  – step through history (labels in undoLabel / redoLabel)
 *   editor.replaceDocument(label, doc) – swap in a whole document (import, "load theirs"), undoable too
 *   editor.select(ids, { additive }) / editor.clearSelection()
 *   editor.revision                 – bumps on every change (watch it to save or re-score)
 *
 * The document is a shallowRef: mutate it only inside applyChange (mutations elsewhere are not seen).
 * Helpers below (addPlanting, deleteSelected, nudgeSelected, …) are thin wrappers over applyChange.
 */
import { defineStore } from 'pinia'
import { computed, ref, shallowRef, triggerRef } from 'vue'
import { emptyYardDocument, isAreaPlanting, type YardArea, type YardDocument, type YardLine, type YardPlanting } from '#shared/schemas/yard-document'
import type { Units } from '#shared/utils/units'
import type { Point } from '#shared/utils/polygon'
import { allIds, deleteElements, duplicateElements, findElement, layeredShapes, LOT_ID, newId, nextPhase, setPhase, shiftZ, snapStep, translateElements, type Element } from '#shared/utils/yard-edits'
import { phaseOf, type Phase } from '#shared/schemas/yard-document'
import { PHASE_LABELS } from '#shared/utils/labels'
import type { Score, Share } from '#shared/schemas/score'

// the pure edits and geometry live in shared/utils/yard-edits.ts: components import them from there

export type YardAccessLevel = 'owner' | 'edit' | 'view'
export const HISTORY_LIMIT = 150

/** Something outside the document an edit stands for, to be taken back on undo and made again on redo. */
export interface HistoryEffect { kind: 'accept-recommendation'; recommendationId: number }
interface HistoryEntry { label: string; doc: string; selection: string[]; effect?: HistoryEffect }
export type HistoryListener = (effect: HistoryEffect, direction: 'undo' | 'redo') => void

// ---------- the store ----------

export const useEditorStore = defineStore('editor', () => {
  const yardId = ref<number | null>(null)
  const name = ref('')
  const region = ref('US-OH')
  const access = ref<YardAccessLevel>('view')
  const version = ref(1)
  const doc = shallowRef<YardDocument>(emptyYardDocument())
  const selection = ref<string[]>([])
  const past = shallowRef<HistoryEntry[]>([])
  const future = shallowRef<HistoryEntry[]>([])
  // bumps on every change of the document, saved or not
  const revision = ref(0)

  const canEdit = computed(() => access.value !== 'view')
  const canUndo = computed(() => past.value.length > 0)
  const canRedo = computed(() => future.value.length > 0)
  const undoLabel = computed(() => past.value.at(-1)?.label ?? null)
  const redoLabel = computed(() => future.value.at(-1)?.label ?? null)
  const units = computed<Units>(() => doc.value.units ?? 'ft')
  const selectedSet = computed(() => new Set(selection.value))
  const selectedElements = computed(() => selection.value.map((id) => findElement(doc.value, id)).filter((e): e is Element => !!e))

  function load(yard: { id: number; name: string; region: string; access: YardAccessLevel; version: number; document: YardDocument }) {
    yardId.value = yard.id
    name.value = yard.name
    region.value = yard.region
    access.value = yard.access
    version.value = yard.version
    doc.value = { ...emptyYardDocument(), ...JSON.parse(JSON.stringify(yard.document)) }
    selection.value = []
    past.value = []
    future.value = []
    revision.value++
  }

  function snapshot(label: string): HistoryEntry {
    return { label, doc: JSON.stringify(doc.value), selection: [...selection.value] }
  }

  /**
   * The one way to change the document. `mutate` edits the document in place; returning false cancels.
   * Returns true when a change was recorded.
   */
  function applyChange(label: string, mutate: (doc: YardDocument) => void | boolean, options: { select?: string[]; effect?: HistoryEffect } = {}): boolean {
    if (!canEdit.value) return false
    const before: HistoryEntry = { ...snapshot(label), effect: options.effect }
    let result: void | boolean
    try {
      result = mutate(doc.value)
    } catch (e) {
      doc.value = JSON.parse(before.doc)
      throw e
    }
    if (result === false) {
      doc.value = JSON.parse(before.doc)
      return false
    }
    past.value = [...past.value.slice(-(HISTORY_LIMIT - 1)), before]
    future.value = []
    if (options.select) selection.value = options.select
    else selection.value = selection.value.filter((id) => findElement(doc.value, id))
    triggerRef(doc)
    revision.value++
    return true
  }

  function replaceDocument(label: string, next: YardDocument, options: { select?: string[] } = {}) {
    return applyChange(label, (d) => {
      for (const k of Object.keys(d)) delete (d as Record<string, unknown>)[k]
      Object.assign(d, emptyYardDocument(), JSON.parse(JSON.stringify(next)))
    }, { select: options.select ?? [] })
  }

  // told when undo or redo passes an edit that stands for something outside the document
  const historyListeners = new Set<HistoryListener>()
  function onHistoryEffect(listener: HistoryListener) {
    historyListeners.add(listener)
    return () => historyListeners.delete(listener)
  }

  function step(from: typeof past, to: typeof past, direction: 'undo' | 'redo') {
    const entry = from.value.at(-1)
    if (!entry || !canEdit.value) return null
    to.value = [...to.value, { ...snapshot(entry.label), effect: entry.effect }]
    from.value = from.value.slice(0, -1)
    doc.value = JSON.parse(entry.doc)
    selection.value = entry.selection.filter((id) => findElement(doc.value, id))
    revision.value++
    if (entry.effect) for (const listener of historyListeners) listener(entry.effect, direction)
    return entry.label
  }
  const undo = () => step(past, future, 'undo')
  const redo = () => step(future, past, 'redo')

  function select(ids: string[], opts: { additive?: boolean; toggle?: boolean } = {}) {
    if (opts.toggle) {
      const set = new Set(selection.value)
      for (const id of ids) set.has(id) ? set.delete(id) : set.add(id)
      selection.value = [...set]
    } else if (opts.additive) selection.value = [...new Set([...selection.value, ...ids])]
    else selection.value = [...ids]
  }
  const clearSelection = () => { selection.value = [] }

  // ----- common edits, all through applyChange -----
  function addArea(area: Omit<YardArea, 'id' | 'z'> & { z?: number }) {
    const id = newId('a', allIds(doc.value))
    const top = Math.max(0, ...layeredShapes(doc.value).map((s) => s.z ?? 0)) + 1
    applyChange(`Draw ${area.kind}`, (d) => { d.areas.push({ z: top, ...area, id } as YardArea) }, { select: [id] })
    return id
  }
  function addPlanting(planting: Omit<YardPlanting, 'id'>, label = 'Place a plant') {
    const id = newId('p', allIds(doc.value))
    const p = { ...planting, id } as YardPlanting
    if (isAreaPlanting(p) && p.z === undefined) p.z = Math.max(0, ...layeredShapes(doc.value).map((s) => s.z ?? 0)) + 1
    applyChange(label, (d) => { d.plantings.push(p) }, { select: [id] })
    return id
  }
  function addLine(line: Omit<YardLine, 'id'>) {
    const id = newId('l', allIds(doc.value))
    applyChange(line.kind === 'overhead' ? 'Draw an overhead line' : 'Draw a buried line', (d) => { d.lines.push({ ...line, id }) }, { select: [id] })
    return id
  }
  function setBoundary(points: Point[]) {
    applyChange(doc.value.boundary.length ? 'Redraw the lot' : 'Draw the lot', (d) => { d.boundary = points }, { select: [LOT_ID] })
  }
  /** Changes fields of one element (not geometry of the lot). */
  function updateElement(id: string, patch: Record<string, unknown>, label = 'Edit') {
    return applyChange(label, (d) => {
      const el = findElement(d, id)
      if (!el || el.type === 'lot') return false
      for (const [k, v] of Object.entries(patch)) {
        if (v === undefined) delete (el.item as Record<string, unknown>)[k]
        else (el.item as Record<string, unknown>)[k] = v
      }
    })
  }
  function setPoints(id: string, points: Point[], label = 'Reshape') {
    return applyChange(label, (d) => {
      const el = findElement(d, id)
      if (!el) return false
      if (el.type === 'lot') d.boundary = points
      else (el.item as { points: Point[] }).points = points
    })
  }
  function deleteSelected() {
    const ids = [...selection.value]
    if (!ids.length) return
    applyChange(ids.length === 1 ? 'Delete' : `Delete ${ids.length} elements`, (d) => deleteElements(d, ids), { select: [] })
  }
  function duplicateSelected() {
    const ids = selection.value.filter((id) => id !== LOT_ID)
    if (!ids.length) return
    let created: string[] = []
    const offset = snapStep(units.value) * 4
    applyChange('Duplicate', (d) => { created = duplicateElements(d, ids, offset, offset) })
    selection.value = created
  }
  function nudgeSelected(dx: number, dy: number) {
    const ids = [...selection.value]
    if (!ids.length) return
    applyChange('Nudge', (d) => translateElements(d, ids, dx, dy))
  }
  /** Sets the phase of the given areas and plantings (the selection by default). */
  function setPhaseOf(phase: Phase, ids: string[] = [...selection.value]) {
    const targets = ids.filter((id) => { const el = findElement(doc.value, id); return el?.type === 'area' || el?.type === 'planting' })
    if (!targets.length) return false
    return applyChange(targets.length === 1 ? `Mark ${PHASE_LABELS[phase].toLowerCase()}` : `Mark ${targets.length} elements ${PHASE_LABELS[phase].toLowerCase()}`, (d) => setPhase(d, targets, phase))
  }
  /** One key steps the selection's phase on: there now → to plant → to remove → there now. */
  function cyclePhaseSelected() {
    const first = selectedElements.value.find((e) => e.type === 'area' || e.type === 'planting')
    if (!first || !('item' in first)) return null
    const next = nextPhase(phaseOf(first.item as { phase?: Phase }))
    return setPhaseOf(next) ? next : null
  }
  function moveSelectedZ(direction: 1 | -1) {
    const ids = selection.value.filter((id) => {
      const el = findElement(doc.value, id)
      return el?.type === 'area' || (el?.type === 'planting' && isAreaPlanting(el.item))
    })
    if (!ids.length) return
    applyChange(direction === 1 ? 'Bring forward' : 'Send back', (d) => shiftZ(d, ids, direction))
  }

  return {
    yardId, name, region, access, version, doc, selection, past, future, revision, onHistoryEffect,
    canEdit, canUndo, canRedo, undoLabel, redoLabel, units, selectedSet, selectedElements,
    load, applyChange, replaceDocument, undo, redo, select, clearSelection,
    addArea, addPlanting, addLine, setBoundary, updateElement, setPoints, deleteSelected, duplicateSelected,
    nudgeSelected, moveSelectedZ, setPhaseOf, cyclePhaseSelected,
  }
})

// ---------- what the editor is doing (not part of the document, not undoable) ----------

export type Tool = 'select' | 'pan' | 'lot' | 'building' | 'paving' | 'bed' | 'water' | 'plant' | 'drift' | 'lawn'
  | 'overhead' | 'buried' | 'measure' | 'calibrate'
export type ShapeMode = 'rect' | 'polygon'

export interface PlantChoice { species: string | null; commonName?: string | null; spread?: number; height?: number; spacing?: number | null }

export type ScoreShare = Share
export type ScoreResult = Score
export type PlantingStatusName = 'native' | 'introduced' | 'invasive' | 'nativeAndIntroduced' | 'unknown'

export const useEditorViewStore = defineStore('editor-view', () => {
  const tool = ref<Tool>('select')
  const shape = ref<ShapeMode>('rect')
  const snapping = ref(true)
  // what the plant and drift tools put down
  const plantChoice = ref<PlantChoice>({ species: null })
  const score = shallowRef<ScoreResult | null>(null)
  const scoreState = ref<'idle' | 'scoring' | 'unavailable' | 'error'>('idle')
  // the same map while no planting's line changed, so a drag that moves a plant within the lot redraws nothing else
  let lastLines = new Map<string, Score['plantings'][number]>()
  const statusById = computed(() => {
    const lines = score.value?.plantings ?? []
    const same = lines.length === lastLines.size && lines.every((l) => {
      const o = lastLines.get(l.id)
      return o !== undefined && o.status === l.status && o.layer === l.layer && o.count === l.count && o.area === l.area && o.volume === l.volume && o.cultivar === l.cultivar
    })
    if (!same) lastLines = new Map(lines.map((p) => [p.id, p]))
    return lastLines
  })
  const message = ref<{ text: string; kind: 'info' | 'error' } | null>(null)
  let timer: ReturnType<typeof setTimeout> | undefined
  function say(text: string, kind: 'info' | 'error' = 'info') {
    message.value = { text, kind }
    clearTimeout(timer)
    timer = setTimeout(() => { message.value = null }, 4000)
  }
  // advisors' pins from site visits, drawn over the plan (not part of the document)
  const pins = shallowRef<VisitPin[]>([])
  // while elements are dragged: where they are now (not yet in the document), so the score can follow
  const dragPreview = shallowRef<Map<string, { x?: number; y?: number; spread?: number; points?: Point[] }> | null>(null)
  // which phases the plan shows: the yard now, with the plan, or both at once
  const phaseShown = ref<'now' | 'planned' | 'both'>('both')
  // years after planting the plan is seen at (null: at maturity, so nothing is hidden)
  const years = ref<number | null>(null)
  // bumps when work is marked done, so the history chart reloads
  const historyRevision = ref(0)
  return { historyRevision, tool, shape, snapping, plantChoice, score, scoreState, statusById, message, say, pins, dragPreview, phaseShown, years }
})

export interface VisitPin { id: number; x: number; y: number; comment: string }

