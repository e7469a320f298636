// Autosave a second after the last edit, with the version that was edited. Every edit is also kept on this
// device (IndexedDB, app/utils/offline-store.ts) until the server has it, so work made offline survives a
// closed tab; when the network returns it goes through the same versioned save, and a stale version opens
// the conflict choice.
import { useEditorStore } from '~/stores/editor'
import { dropPendingYard, keepPendingYard, readPendingYard, type PendingYardEdit } from '~/utils/offline-store'

export type SaveState = 'saved' | 'unsaved' | 'saving' | 'offline' | 'conflict' | 'error'
export type YardDraft = PendingYardEdit

export const AUTOSAVE_DELAY_MS = 1000
/** While offline, how often a save is tried again besides the browser's own "online" event. */
export const OFFLINE_RETRY_MS = 5000

function currentUserId(): number | null {
  return useUserSession().user.value?.id ?? null
}
export async function readYardDraft(yardId: number): Promise<YardDraft | null> {
  const userId = currentUserId()
  return userId ? readPendingYard(userId, yardId) : null
}

export function useYardAutosave() {
  const editor = useEditorStore()
  const userId = currentUserId()
  const state = ref<SaveState>('saved')
  const error = ref('')
  const conflictVersion = ref<number | null>(null)
  const lastSavedAt = ref<Date | null>(null)
  // the revision the server has; edits after it are unsaved
  let savedRevision = editor.revision
  let timer: ReturnType<typeof setTimeout> | undefined
  let retry: ReturnType<typeof setTimeout> | undefined
  let inFlight = false
  // writes to the device in order, so an older document never lands after a newer one
  let keeping: Promise<void> = Promise.resolve()

  // saved copies are kept too: a page opened offline comes from the browser's cache and may be older
  function keepOnDevice(unsaved = true, document = editor.doc) {
    const yardId = editor.yardId
    if (!yardId || !userId || !editor.canEdit) return
    const edit = { userId, yardId, baseVersion: editor.version, unsaved, document }
    keeping = keeping.then(() => keepPendingYard(edit))
  }

  /** The current document is what the server has (after load, or after loading their version). */
  /** Nothing of this yard stays on the device (its edits went somewhere else). */
  function forget() {
    const yardId = editor.yardId
    if (yardId) keeping = keeping.then(() => dropPendingYard(yardId))
    return keeping
  }

  function markSaved() {
    savedRevision = editor.revision
    clearTimeout(timer)
    state.value = 'saved'
    keepOnDevice(false)
  }

  function goOffline() {
    state.value = 'offline'
    clearTimeout(retry)
    retry = setTimeout(save, OFFLINE_RETRY_MS)
  }

  async function save() {
    clearTimeout(timer)
    clearTimeout(retry)
    if (!editor.canEdit || !editor.yardId || state.value === 'conflict') return
    if (inFlight) { timer = setTimeout(save, 300); return }
    if (editor.revision === savedRevision) { state.value = 'saved'; return }
    if (typeof navigator !== 'undefined' && navigator.onLine === false) { goOffline(); return }
    const revision = editor.revision
    const yardId = editor.yardId
    const document = editor.doc
    inFlight = true
    state.value = 'saving'
    try {
      const res = await $fetch<{ version: number }>(`/api/yards/${yardId}`, { method: 'PUT', body: { version: editor.version, document: editor.doc } })
      editor.version = res.version
      savedRevision = revision
      lastSavedAt.value = new Date()
      error.value = ''
      if (editor.yardId !== yardId) return
      if (editor.revision === savedRevision) { state.value = 'saved'; keepOnDevice(false, document) }
      else { state.value = 'unsaved'; keepOnDevice(); timer = setTimeout(save, AUTOSAVE_DELAY_MS) }
    } catch (e) {
      const err = e as { statusCode?: number; data?: { message?: string; data?: { currentVersion?: number } } }
      if (err.statusCode === 409) {
        state.value = 'conflict'
        conflictVersion.value = err.data?.data?.currentVersion ?? null
      } else if (!err.statusCode) {
        goOffline()
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
    keepOnDevice()
    clearTimeout(timer)
    timer = setTimeout(save, AUTOSAVE_DELAY_MS)
  })

  const online = () => { if (state.value === 'offline' || state.value === 'unsaved') save() }
  const offline = () => { if (state.value === 'unsaved' || state.value === 'saving') state.value = 'offline' }
  // edits are on the device already; the browser asks only while one is on its way to the server
  const leaving = (e: BeforeUnloadEvent) => { if (editor.revision !== savedRevision && state.value !== 'offline') e.preventDefault() }
  onMounted(() => {
    window.addEventListener('online', online)
    window.addEventListener('offline', offline)
    window.addEventListener('beforeunload', leaving)
  })
  onBeforeUnmount(() => {
    clearTimeout(timer)
    clearTimeout(retry)
    window.removeEventListener('online', online)
    window.removeEventListener('offline', offline)
    window.removeEventListener('beforeunload', leaving)
  })

  function resolveConflict() {
    conflictVersion.value = null
    state.value = editor.revision === savedRevision ? 'saved' : 'unsaved'
  }

  return { state, error, conflictVersion, lastSavedAt, save, markSaved, forget, resolveConflict }
}
