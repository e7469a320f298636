// Re-scores the document on the server shortly after every change; the result colours the plan. The first
// request sends the whole yard; later ones send only what changed since the last answer (its `basis`), and get
// back only the planting lines that changed. When the server no longer holds that basis (409) the whole yard
// goes again.
import type { ScoreUpdate, ScoreWithBasis } from '#shared/schemas/score'
import type { YardDocument } from '#shared/schemas/yard-document'
import { changesSince, mergeScoreUpdate, yardSnapshot, type YardSnapshot } from '#shared/utils/yard-changes'
import { useEditorStore, useEditorViewStore, type ScoreResult } from '~/stores/editor'

export const SCORE_DELAY_MS = 350

interface Acknowledged { seq: number; basis: string; snapshot: YardSnapshot; score: ScoreResult }

export function useYardScore() {
  const editor = useEditorStore()
  const view = useEditorViewStore()
  const error = ref('')
  let timer: ReturnType<typeof setTimeout> | undefined
  let ticket = 0
  let acked: Acknowledged | null = null

  async function scoreOf(doc: YardDocument, seq: number): Promise<ScoreResult> {
    const base = acked
    const snapshot = yardSnapshot(doc)
    const changes = base && changesSince(base.snapshot, doc, snapshot)
    let result: { score: ScoreResult; basis: string } | null = null
    if (base && changes) {
      try {
        const update = await $fetch<ScoreUpdate>('/api/score', { method: 'POST', body: { basis: base.basis, changes } })
        result = { score: mergeScoreUpdate(base.score, update, doc), basis: update.basis }
      } catch (e) {
        if ((e as { statusCode?: number }).statusCode !== 409) throw e
      }
    }
    if (!result) {
      const { basis, ...score } = await $fetch<ScoreWithBasis>('/api/score', { method: 'POST', body: doc })
      result = { score, basis }
    }
    // answers can arrive out of order; the newest request's answer is the base for the next changes
    if (!acked || seq > acked.seq) acked = { seq, basis: result.basis, snapshot, score: result.score }
    return result.score
  }

  async function run() {
    const mine = ++ticket
    view.scoreState = 'scoring'
    try {
      const doc = { ...toRaw(editor.doc), region: editor.region } as YardDocument
      const result = await scoreOf(doc, mine)
      if (mine !== ticket) return
      view.score = result
      view.scoreState = 'idle'
      error.value = ''
    } catch (e) {
      if (mine !== ticket) return
      const err = e as { statusCode?: number; data?: { message?: string } }
      if (err.statusCode === 404) view.scoreState = 'unavailable'
      else if (!err.statusCode) {
        view.scoreState = 'error'
        error.value = 'Offline: the score is worked out again when the connection returns'
      } else {
        view.scoreState = 'error'
        error.value = err.data?.message ?? 'The score could not be worked out'
      }
    }
  }
  watch(() => editor.revision, () => {
    clearTimeout(timer)
    timer = setTimeout(run, SCORE_DELAY_MS)
  })
  onMounted(() => { run(); window.addEventListener('online', run) })
  onBeforeUnmount(() => { clearTimeout(timer); window.removeEventListener('online', run) })
  return { error, run }
}
