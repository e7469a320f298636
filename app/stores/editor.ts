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
import { METRES_PER_FOOT, type Units } from '#shared/utils/units'
import { ringArea, type Point } from '#shared/utils/polygon'
import type { Score, Share } from '#shared/schemas/score'

export type YardAccessLevel = 'owner' | 'edit' | 'view'
export type Element =
  | { type: 'lot'; id: 'lot'; points: Point[] }
  | { type: 'area'; id: string; item: YardArea }
  | { type: 'planting'; id: string; item: YardPlanting }
  | { type: 'line'; id: string; item: YardLine }

export const LOT_ID = 'lot'
export const HISTORY_LIMIT = 150

/** Something outside the document an edit stands for, to be taken back on undo and made again on redo. */
export interface HistoryEffect { kind: 'accept-recommendation'; recommendationId: number }
interface HistoryEntry { label: string; doc: string; selection: string[]; effect?: HistoryEffect }
export type HistoryListener = (effect: HistoryEffect, direction: 'undo' | 'redo') => void

// ---------- pure helpers (unit-tested) ----------

/** Grid step for snapping: half a foot, or ten centimetres, in metres. */
export function snapStep(units: Units): number {
  return units === 'ft' ? 0.5 * METRES_PER_FOOT : 0.1
}

export function snapValue(v: number, step: number): number {
  // round to the grid, then to a micrometre so that 0.1 m steps do not drift into 0.30000000000000004
  return Math.round(Math.round(v / step) * step * 1e6) / 1e6
}

export function snapPoint(p: Point, step: number): Point {
  return [snapValue(p[0], step), snapValue(p[1], step)]
}

/** Plants in a drift at on-centre spacing s in a triangular layout: area / (0.866 s²), rounded up. */
export function driftPlantCount(points: Point[], spacing: number | null | undefined): number | null {
  if (!spacing) return null
  return Math.ceil(ringArea(points) / (0.866 * spacing * spacing))
}

export function newId(prefix: string, taken: Set<string>): string {
  for (;;) {
    const id = `${prefix}${Math.random().toString(36).slice(2, 8)}`
    if (!taken.has(id)) return id
  }
}

export function allIds(doc: YardDocument): Set<string> {
  return new Set([LOT_ID, ...doc.areas.map((a) => a.id), ...doc.plantings.map((p) => p.id), ...doc.lines.map((l) => l.id)])
}

export function findElement(doc: YardDocument, id: string): Element | null {
  if (id === LOT_ID) return doc.boundary.length ? { type: 'lot', id: LOT_ID, points: doc.boundary as Point[] } : null
  const area = doc.areas.find((a) => a.id === id)
  if (area) return { type: 'area', id, item: area }
  const planting = doc.plantings.find((p) => p.id === id)
  if (planting) return { type: 'planting', id, item: planting }
  const line = doc.lines.find((l) => l.id === id)
  if (line) return { type: 'line', id, item: line }
  return null
}

/** Moves every point of the listed elements by (dx, dy) metres. */
export function translateElements(doc: YardDocument, ids: Iterable<string>, dx: number, dy: number): void {
  const move = (pts: Point[]) => pts.forEach((p) => { p[0] += dx; p[1] += dy })
  for (const id of ids) {
    const el = findElement(doc, id)
    if (!el) continue
    if (el.type === 'lot') move(doc.boundary as Point[])
    else if (el.type === 'planting' && !isAreaPlanting(el.item)) { el.item.x = (el.item.x ?? 0) + dx; el.item.y = (el.item.y ?? 0) + dy }
    else move((el.item as { points: Point[] }).points)
  }
}

/** Copies of the listed elements (not the lot), offset by (dx, dy), with fresh ids. Returns the new ids. */
export function duplicateElements(doc: YardDocument, ids: string[], dx: number, dy: number): string[] {
  const taken = allIds(doc)
  const created: string[] = []
  for (const id of ids) {
    const el = findElement(doc, id)
    if (!el || el.type === 'lot') continue
    const copy = JSON.parse(JSON.stringify(el.item)) as typeof el.item
    copy.id = newId(el.type === 'area' ? 'a' : el.type === 'planting' ? 'p' : 'l', taken)
    taken.add(copy.id)
    if (el.type === 'area') doc.areas.push(copy as YardArea)
    else if (el.type === 'planting') doc.plantings.push(copy as YardPlanting)
    else doc.lines.push(copy as YardLine)
    created.push(copy.id)
  }
  translateElements(doc, created, dx, dy)
  return created
}

export function deleteElements(doc: YardDocument, ids: Iterable<string>): void {
  const gone = new Set(ids)
  if (gone.has(LOT_ID)) doc.boundary = []
  doc.areas = doc.areas.filter((a) => !gone.has(a.id))
  doc.plantings = doc.plantings.filter((p) => !gone.has(p.id))
  doc.lines = doc.lines.filter((l) => !gone.has(l.id))
}

/** The drawing order of areas and area plantings: by z, then by position in their list (later on top). */
export function layeredShapes(doc: YardDocument): Array<YardArea | (YardPlanting & { points: Point[] })> {
  const items: Array<{ item: YardArea | (YardPlanting & { points: Point[] }); z: number; order: number }> = []
  doc.areas.forEach((a, i) => items.push({ item: a, z: a.z ?? 0, order: i }))
  doc.plantings.forEach((p, i) => { if (isAreaPlanting(p)) items.push({ item: p, z: p.z ?? 0, order: 10_000 + i }) })
  return items.sort((a, b) => a.z - b.z || a.order - b.order).map((x) => x.item)
}

/** Renumbers z so that the listed shapes move one step up (or down) past their neighbour. */
export function shiftZ(doc: YardDocument, ids: string[], direction: 1 | -1): void {
  const order = layeredShapes(doc)
  const moving = new Set(ids)
  const list = direction === 1 ? [...order].reverse() : [...order]
  // bubble each moving shape past the next non-moving one
  for (let i = 1; i < list.length; i++) {
    if (moving.has(list[i]!.id) && !moving.has(list[i - 1]!.id)) [list[i - 1], list[i]] = [list[i]!, list[i - 1]!]
  }
  const final = direction === 1 ? list.reverse() : list
  final.forEach((item, i) => { item.z = i })
}

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
    nudgeSelected, moveSelectedZ,
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
  return { tool, shape, snapping, plantChoice, score, scoreState, statusById, message, say, pins, dragPreview }
})

export interface VisitPin { id: number; x: number; y: number; comment: string }

// ---------- geometry for hit-testing and cautions (pure, unit-tested) ----------

export function distanceToSegment(p: Point, a: Point, b: Point): number {
  const dx = b[0] - a[0]
  const dy = b[1] - a[1]
  const len2 = dx * dx + dy * dy
  const t = len2 ? Math.max(0, Math.min(1, ((p[0] - a[0]) * dx + (p[1] - a[1]) * dy) / len2)) : 0
  return Math.hypot(p[0] - (a[0] + t * dx), p[1] - (a[1] + t * dy))
}

export function distanceToPolyline(p: Point, pts: Point[], closed = false): number {
  let best = Infinity
  const n = pts.length
  for (let i = 0; i < (closed ? n : n - 1); i++) best = Math.min(best, distanceToSegment(p, pts[i]!, pts[(i + 1) % n]!))
  return best
}

/** 0 inside the polygon, else the distance to its edge. */
export function distanceToPolygon(p: Point, pts: Point[]): number {
  return pointInPolygon(p, pts) ? 0 : distanceToPolyline(p, pts, true)
}

export function pointInPolygon(p: Point, ring: Point[]): boolean {
  let inside = false
  for (let i = 0, j = ring.length - 1; i < ring.length; j = i++) {
    const [xi, yi] = ring[i]!
    const [xj, yj] = ring[j]!
    if ((yi > p[1]) !== (yj > p[1]) && p[0] < ((xj - xi) * (p[1] - yi)) / (yj - yi) + xi) inside = !inside
  }
  return inside
}

export interface Box { minX: number; minY: number; maxX: number; maxY: number }

export function boundsOf(points: Point[]): Box {
  const box = { minX: Infinity, minY: Infinity, maxX: -Infinity, maxY: -Infinity }
  for (const [x, y] of points) {
    box.minX = Math.min(box.minX, x); box.maxX = Math.max(box.maxX, x)
    box.minY = Math.min(box.minY, y); box.maxY = Math.max(box.maxY, y)
  }
  return box
}

/** Radius drawn for a point planting: one plant's spread, or a clump of `count` plants with the same area. */
export function plantRadius(p: YardPlanting, fallbackSpread = 1): number {
  return ((p.spread ?? fallbackSpread) / 2) * Math.sqrt(Math.max(1, p.count ?? 1))
}

export function elementBounds(doc: YardDocument, id: string): Box | null {
  const el = findElement(doc, id)
  if (!el) return null
  if (el.type === 'lot') return boundsOf(el.points)
  if (el.type === 'planting' && !isAreaPlanting(el.item)) {
    const r = plantRadius(el.item)
    const x = el.item.x ?? 0
    const y = el.item.y ?? 0
    return { minX: x - r, minY: y - r, maxX: x + r, maxY: y + r }
  }
  return boundsOf((el.item as { points: Point[] }).points)
}

/**
 * The topmost element under a point: point plantings first (smallest on top), then lines, then areas and
 * drifts from the top of the z-order, then the lot's edge. `tolerance` is in metres (a few pixels).
 */
export function hitTest(doc: YardDocument, p: Point, tolerance: number): string | null {
  let best: { id: string; r: number } | null = null
  for (const pl of doc.plantings) {
    if (isAreaPlanting(pl)) continue
    const r = plantRadius(pl)
    const d = Math.hypot(p[0] - (pl.x ?? 0), p[1] - (pl.y ?? 0))
    if (d <= r + tolerance && (!best || r < best.r)) best = { id: pl.id, r }
  }
  if (best) return best.id
  for (const line of doc.lines) if (distanceToPolyline(p, line.points as Point[]) <= tolerance * 2) return line.id
  const shapes = layeredShapes(doc)
  for (let i = shapes.length - 1; i >= 0; i--) if (pointInPolygon(p, shapes[i]!.points as Point[])) return shapes[i]!.id
  if (doc.boundary.length && distanceToPolyline(p, doc.boundary as Point[], true) <= tolerance * 2) return LOT_ID
  return null
}

/** Ids of elements whose bounds lie wholly inside the box (the lot only when asked). */
export function elementsInBox(doc: YardDocument, box: Box): string[] {
  const inside = (b: Box | null) => !!b && b.minX >= box.minX && b.maxX <= box.maxX && b.minY >= box.minY && b.maxY <= box.maxY
  return [...doc.areas, ...doc.plantings, ...doc.lines].map((e) => e.id).filter((id) => inside(elementBounds(doc, id)))
}
