// A site visit's notes and photos, kept on this device when there is no network and sent in the order they
// were made once it returns (on the browser's "online" event, or when the visit page opens online).
import { dropPending, keepVisitNotes, keepVisitPhoto, pendingForVisit, type PendingVisitNotes, type PendingVisitPhoto } from '~/utils/offline-store'

const isNetworkError = (e: unknown) => !(e as { statusCode?: number }).statusCode

export function useVisitQueue(visitId: number, onSent: () => Promise<unknown> | void) {
  const userId = useUserSession().user.value?.id ?? 0
  const pending = ref<Array<PendingVisitNotes | PendingVisitPhoto>>([])
  const previews = ref<Record<string, string>>({})
  const problem = ref('')
  let flushing = false

  async function reload() {
    pending.value = await pendingForVisit(userId, visitId)
    for (const p of pending.value) {
      if (p.kind === 'visit-photo' && !previews.value[p.key]) previews.value[p.key] = URL.createObjectURL(p.file)
    }
  }

  function sendNotes(notes: string) {
    return $fetch(`/api/visits/${visitId}`, { method: 'PUT', body: { notes } })
  }
  function sendPhoto(file: Blob, name: string, caption: string) {
    const form = new FormData()
    form.append('file', file, name)
    return $fetch(`/api/visits/${visitId}/photos`, { method: 'POST', body: form, query: { caption } })
  }

  /** 'sent', or 'kept' when it waits on this device for the network. Server refusals are thrown. */
  async function saveNotes(notes: string): Promise<'sent' | 'kept'> {
    if (navigator.onLine) {
      try {
        await sendNotes(notes)
        await dropPending(`visit-notes:${visitId}`)
        await reload()
        return 'sent'
      } catch (e) {
        if (!isNetworkError(e)) throw e
      }
    }
    await keepVisitNotes(userId, visitId, notes)
    await reload()
    return 'kept'
  }

  async function addPhoto(file: File, caption: string): Promise<'sent' | 'kept'> {
    if (navigator.onLine) {
      try {
        await sendPhoto(file, file.name, caption)
        return 'sent'
      } catch (e) {
        if (!isNetworkError(e)) throw e
      }
    }
    await keepVisitPhoto(userId, visitId, file, file.name, caption)
    await reload()
    return 'kept'
  }

  async function flush() {
    if (flushing || !navigator.onLine) return
    flushing = true
    problem.value = ''
    let sent = 0
    try {
      for (const item of await pendingForVisit(userId, visitId)) {
        const key = item.kind === 'visit-notes' ? `visit-notes:${visitId}` : item.key
        try {
          if (item.kind === 'visit-notes') await sendNotes(item.notes)
          else await sendPhoto(item.file, item.name, item.caption)
        } catch (e) {
          if (isNetworkError(e)) break
          // refused for good (not an image, too large, the visit closed): say so rather than retry forever
          const what = item.kind === 'visit-notes' ? 'The notes kept on this device' : `The photo ${item.name}`
          problem.value = `${what} could not be saved: ${(e as { data?: { message?: string } }).data?.message ?? 'refused by the server'}`
        }
        await dropPending(key)
        if (item.kind === 'visit-photo' && previews.value[item.key]) URL.revokeObjectURL(previews.value[item.key]!)
        sent++
      }
    } finally {
      flushing = false
      await reload()
    }
    if (sent) await onSent()
  }

  onMounted(async () => {
    await reload()
    await flush()
    window.addEventListener('online', flush)
  })
  onBeforeUnmount(() => {
    window.removeEventListener('online', flush)
    for (const url of Object.values(previews.value)) URL.revokeObjectURL(url)
  })

  return { pending, previews, problem, saveNotes, addPhoto, flush }
}
