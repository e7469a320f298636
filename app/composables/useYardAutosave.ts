// Autosave a second after the last edit, with the version that was edited; unsaved work is kept in the
// browser (localStorage) until the server has it, and a stale version opens the conflict choice.
import type { YardDocument } from '#shared/schemas/yard-document'
import { useEditorStore } from '~/stores/editor'

export type SaveState = 'saved' | 'unsaved' | 'saving' | 'offline' | 'conflict' | 'error'
export interface YardDraft { yardId: number; baseVersion: number; savedAt: string; document: YardDocument }

export const AUTOSAVE_DELAY_MS = 1000
const draftKey = (yardId: number) => `wildward.yard-draft.${yardId}`

export function readYardDraft(yardId: number): YardDraft | null {
  try {
    const raw = localStorage.getItem(draftKey(yardId))
    return raw ? JSON.parse(raw) as YardDraft : null
  } catch {
    return null
  }
}
export function clearYardDraft(yardId: number) {
  try { localStorage.removeItem(draftKey(yardId)) } catch {}
}

export function useYardAutosave() {
  const editor = useEditorStore()
  const state = ref<SaveState>('saved')
  const error = ref('')
  const conflictVersion = ref<number | null>(null)
  const lastSavedAt = ref<Date | null>(null)
  // the revision the server has; edits after it are unsaved
  let savedRevision = editor.revision
  let timer: ReturnType<typeof setTimeout> | undefined
  let retry: ReturnType<typeof setTimeout> | undefined
  let inFlight = false

  function writeDraft() {
    if (!editor.yardId) return
    try {
      const draft: YardDraft = { yardId: editor.yardId, baseVersion: editor.version, savedAt: new Date().toISOString(), document: editor.doc }
      localStorage.setItem(draftKey(editor.yardId), JSON.stringify(draft))
    } catch {
      // a full or blocked localStorage must not stop editing; the save to the server still runs
    }
  }

  /** The current document is what the server has (after load, or after loading their version). */
  function markSaved() {
    savedRevision = editor.revision
    clearTimeout(timer)
    state.value = 'saved'
    if (editor.yardId) clearYardDraft(editor.yardId)
  }

  async function save() {
    clearTimeout(timer)
    if (!editor.canEdit || !editor.yardId || state.value === 'conflict') return
    if (inFlight) { timer = setTimeout(save, 300); return }
    if (editor.revision === savedRevision) { state.value = 'saved'; return }
    const revision = editor.revision
    inFlight = true
    state.value = 'saving'
    try {
      const res = await $fetch<{ version: number }>(`/api/yards/${editor.yardId}`, { method: 'PUT', body: { version: editor.version, document: editor.doc } })
      editor.version = res.version
      savedRevision = revision
      lastSavedAt.value = new Date()
      error.value = ''
      if (editor.revision === savedRevision) { state.value = 'saved'; clearYardDraft(editor.yardId) }
      else { state.value = 'unsaved'; timer = setTimeout(save, AUTOSAVE_DELAY_MS) }
    } catch (e) {
      const err = e as { statusCode?: number; data?: { message?: string; data?: { currentVersion?: number } } }
      if (err.statusCode === 409) {
        state.value = 'conflict'
        conflictVersion.value = err.data?.data?.currentVersion ?? null
      } else if (!err.statusCode) {
        state.value = 'offline'
        retry = setTimeout(save, 5000)
      } else {
        state.value = 'error'
        error.value = err.data?.message ?? 'The plan could not be saved'
      }
    } finally {
      inFlight = false
    }
  }

  watch(() => editor.revision, (rev) => {
    if (rev === savedRevision || !editor.canEdit) return
    if (state.value !== 'conflict') state.value = state.value === 'offline' ? 'offline' : 'unsaved'
    writeDraft()
    clearTimeout(timer)
    timer = setTimeout(save, AUTOSAVE_DELAY_MS)
  })

  const online = () => { if (state.value === 'offline') save() }
  const leaving = (e: BeforeUnloadEvent) => { if (editor.revision !== savedRevision) e.preventDefault() }
  onMounted(() => {
    window.addEventListener('online', online)
    window.addEventListener('beforeunload', leaving)
  })
  onBeforeUnmount(() => {
    clearTimeout(timer)
    clearTimeout(retry)
    window.removeEventListener('online', online)
    window.removeEventListener('beforeunload', leaving)
  })

  function resolveConflict() {
    conflictVersion.value = null
    state.value = editor.revision === savedRevision ? 'saved' : 'unsaved'
  }

  return { state, error, conflictVersion, lastSavedAt, save, markSaved, resolveConflict }
}
