// Scores the yard in the browser with the same engine the server uses (shared/utils/score), on every edit:
// the shares, the chart and the moves change in the same frame as the edit, also with the network down. The
// server only supplies the inputs: the goal and the facts of the species the yard names (one request when the
// yard opens; another for a region change or a species not seen yet). Saved yards are scored by the server
// for pledges, the dashboard, printing and certificates (GET /api/yards/[id]/score).
import { defineStore } from 'pinia'
import type { ScoreInputs } from '#shared/schemas/score'
import type { YardDocument } from '#shared/schemas/yard-document'
import type { SpeciesFacts } from '#shared/types/species'
import type { Point } from '#shared/utils/polygon'
import { createScoreMemo, scoreYard, speciesKeys } from '#shared/utils/score'
import { nameKey } from '#shared/utils/species-name'
import { useEditorStore, useEditorViewStore } from '~/stores/editor'

/** The goal and species facts for the yard being edited, and the engine's memo for it. */
export const useScoreInputsStore = defineStore('score-inputs', () => {
  const goal = ref<number | null>(null)
  const region = ref<string | null>(null)
  // replaced (never mutated) when facts arrive, so watchers see the change
  const facts = shallowRef(new Map<string, SpeciesFacts>())
  // names asked for in this region, answered or not (a name missing from the catalogue stays missing)
  let asked = new Set<string>()
  const pending = ref(0)
  let memo = createScoreMemo()

  function reset(yardRegion: string | null) {
    goal.value = null
    region.value = yardRegion
    facts.value = new Map()
    asked = new Set()
    memo = createScoreMemo()
  }

  function take(inputs: ScoreInputs, names: Iterable<string>) {
    if (inputs.region !== region.value) return
    goal.value = inputs.goal
    const next = new Map(facts.value)
    for (const [key, f] of Object.entries(inputs.facts)) next.set(key, f)
    for (const n of names) asked.add(nameKey(n))
    facts.value = next
  }

  /** Loads the goal and the facts of a saved yard's species. */
  async function load(yardId: number, yardRegion: string) {
    reset(yardRegion)
    pending.value++
    try {
      const inputs = await $fetch<ScoreInputs>(`/api/yards/${yardId}/facts`)
      const keys = Object.keys(inputs.facts)
      take(inputs, keys)
      return true
    } finally {
      pending.value--
    }
  }

  /** Fetches the facts of names not asked for yet in the current region (a species picked, a region change). */
  async function want(names: Iterable<string>) {
    const where = region.value
    if (!where) return
    const missing = [...new Set([...names].map(nameKey))].filter((k) => !asked.has(k))
    if (!missing.length) return
    for (const k of missing) asked.add(k)
    pending.value++
    try {
      take(await $fetch<ScoreInputs>('/api/species/facts', { method: 'POST', body: { region: where, names: missing } }), missing)
    } catch {
      // asked again on the next edit (offline, or the server is busy)
      for (const k of missing) asked.delete(k)
    } finally {
      pending.value--
    }
  }

  /** A new region: every name is asked for again there. */
  function moveTo(nextRegion: string) {
    if (nextRegion === region.value) return
    region.value = nextRegion
    facts.value = new Map()
    asked = new Set()
  }

  const memoOf = () => memo
  return { goal, region, facts, pending, load, want, moveTo, memoOf }
})

type Preview = Map<string, { x?: number; y?: number; spread?: number; points?: Point[] }>

/** The document with dragged elements where the drag has them (new objects for those only, so the memo keeps the rest). */
export function withPreview(doc: YardDocument, moved: Preview | null): YardDocument {
  if (!moved?.size) return doc
  const lot = moved.get('lot')
  return {
    ...doc,
    boundary: lot?.points ?? doc.boundary,
    areas: doc.areas.map((a) => { const m = moved.get(a.id); return m?.points ? { ...a, points: m.points } : a }),
    plantings: doc.plantings.map((p) => { const m = moved.get(p.id); return m ? { ...p, ...m } : p }),
  }
}

export function useYardScore() {
  const editor = useEditorStore()
  const view = useEditorViewStore()
  const inputs = useScoreInputsStore()
  const error = ref('')

  function run() {
    if (inputs.goal === null) return
    const started = performance.now()
    const doc = withPreview({ ...toRaw(editor.doc), region: editor.region } as YardDocument, view.dragPreview)
    view.score = scoreYard(doc, inputs.facts, inputs.goal, editor.region, inputs.memoOf(), { years: view.years })
    // a User Timing entry (only the latest kept) that the editor benchmark observes
    performance.clearMeasures('wildward:score')
    performance.measure('wildward:score', { start: started })
    // names the facts do not cover yet: fetched, then scored again
    const missing = [...speciesKeys(doc)].filter((k) => !inputs.facts.has(k))
    if (missing.length) void inputs.want(missing)
    view.scoreState = inputs.pending > 0 ? 'scoring' : 'idle'
  }

  async function start() {
    if (!editor.yardId) return
    view.scoreState = 'scoring'
    try {
      await inputs.load(editor.yardId, editor.region)
      error.value = ''
      run()
    } catch (e) {
      const err = e as { statusCode?: number; data?: { message?: string } }
      view.scoreState = err.statusCode === 404 ? 'unavailable' : 'error'
      error.value = err.data?.message ?? 'The species facts for scoring could not be loaded'
    }
  }

  watch(() => [editor.revision, view.dragPreview, view.years], run)
  watch(() => [inputs.facts, inputs.goal, inputs.pending] as const, run)
  watch(() => editor.region, (r) => { inputs.moveTo(r); run() })
  onMounted(start)
  return { error, run: start }
}
