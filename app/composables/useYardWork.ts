// Marking work done from the editor: the plan is saved first, then the server records the work and the yard's
// shares on that date (POST /api/yards/[id]/work), and the editor makes the same change to its copy.
import type { InjectionKey } from 'vue'
import { markWorkDone } from '#shared/utils/yard-edits'
import { useEditorStore, useEditorViewStore } from '~/stores/editor'
import type { useYardAutosave } from './useYardAutosave'

/** Marks ids planted or removed on a date; resolves to an error message, or null when done. */
export type MarkWork = (action: 'planted' | 'removed', ids: string[], date: string) => Promise<string | null>
export const MARK_WORK: InjectionKey<MarkWork> = Symbol('mark-work')

export function useYardWork(autosave: ReturnType<typeof useYardAutosave>) {
  const editor = useEditorStore()
  const view = useEditorViewStore()
  const mark: MarkWork = async (action, ids, date) => {
    // the server records the work on the saved plan: save what is pending first
    for (let i = 0; i < 50 && autosave.state.value !== 'saved'; i++) {
      if (autosave.state.value === 'conflict' || autosave.state.value === 'error' || autosave.state.value === 'offline') return 'Save the plan first (it is not saved just now).'
      await autosave.save()
      // read afresh: the save above changed it
      if (String(autosave.state.value) !== 'saved') await new Promise((r) => setTimeout(r, 200))
    }
    try {
      const res = await $fetch<{ version: number }>(`/api/yards/${editor.yardId}/work`, { method: 'POST', body: { version: editor.version, action, ids, date } })
      editor.applyChange(`Mark ${ids.length === 1 ? '' : `${ids.length} `}${action}`, (d) => markWorkDone(d, { action, ids, date }), { select: action === 'removed' ? [] : ids })
      editor.version = res.version
      autosave.markSaved()
      view.historyRevision++
      view.say(action === 'planted' ? 'Marked planted: the share now is updated and recorded.' : 'Marked removed: the share now is updated and recorded.')
      return null
    } catch (e) {
      const err = e as { data?: { message?: string } }
      return err.data?.message ?? 'The work could not be recorded'
    }
  }
  provide(MARK_WORK, mark)
  return mark
}
