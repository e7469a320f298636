// Re-scores the document on the server shortly after every change; the result colours the plan.
import { useEditorStore, useEditorViewStore, type ScoreResult } from '~/stores/editor'

export const SCORE_DELAY_MS = 350

export function useYardScore() {
  const editor = useEditorStore()
  const view = useEditorViewStore()
  const error = ref('')
  let timer: ReturnType<typeof setTimeout> | undefined
  let ticket = 0

  async function run() {
    const mine = ++ticket
    view.scoreState = 'scoring'
    try {
      const result = await $fetch<ScoreResult>('/api/score', { method: 'POST', body: { ...editor.doc, region: editor.region } })
      if (mine !== ticket) return
      view.score = result
      view.scoreState = 'idle'
      error.value = ''
    } catch (e) {
      if (mine !== ticket) return
      const err = e as { statusCode?: number; data?: { message?: string } }
      if (err.statusCode === 404) view.scoreState = 'unavailable'
      else {
        view.scoreState = 'error'
        error.value = err.data?.message ?? 'The score could not be worked out'
      }
    }
  }
  watch(() => editor.revision, () => {
    clearTimeout(timer)
    timer = setTimeout(run, SCORE_DELAY_MS)
  })
  onMounted(run)
  onBeforeUnmount(() => clearTimeout(timer))
  return { error, run }
}
