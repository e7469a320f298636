// What this device keeps until the server has it: yard edits (one per yard, with the version they were made
// from), visit notes and visit photos. In IndexedDB, so it survives closing the tab; each record names the
// account that made it, so another person signing in on the same device never sends it as theirs.
import { createStore, del, entries, get, set, type UseStore } from 'idb-keyval'
import type { YardDocument } from '#shared/schemas/yard-document'

/** The yard as this device last had it: `unsaved` edits made from `baseVersion`, or the copy the server confirmed. */
export interface PendingYardEdit { kind: 'yard'; userId: number; yardId: number; baseVersion: number; unsaved: boolean; savedAt: string; document: YardDocument }
export interface PendingVisitNotes { kind: 'visit-notes'; userId: number; visitId: number; savedAt: string; notes: string }
export interface PendingVisitPhoto { kind: 'visit-photo'; userId: number; visitId: number; key: string; savedAt: string; caption: string; name: string; file: Blob }
export type PendingItem = PendingYardEdit | PendingVisitNotes | PendingVisitPhoto

let store: UseStore | null = null
function pendingStore(): UseStore | null {
  if (typeof indexedDB === 'undefined') return null
  return (store ??= createStore('wildward-offline', 'pending'))
}

const yardKey = (yardId: number) => `yard:${yardId}`
const notesKey = (visitId: number) => `visit-notes:${visitId}`

export async function readPendingYard(userId: number, yardId: number): Promise<PendingYardEdit | null> {
  const s = pendingStore()
  if (!s) return null
  try {
    const item = await get<PendingYardEdit>(yardKey(yardId), s)
    return item && item.userId === userId ? item : null
  } catch {
    return null
  }
}

/** Keeps the latest document of a yard; a full or blocked store must not stop editing, so errors are swallowed. */
export async function keepPendingYard(edit: Omit<PendingYardEdit, 'kind' | 'savedAt'>): Promise<void> {
  const s = pendingStore()
  if (!s) return
  // a plain copy: Vue's proxies cannot be stored
  const item: PendingYardEdit = { kind: 'yard', savedAt: new Date().toISOString(), ...JSON.parse(JSON.stringify(edit)) }
  try { await set(yardKey(edit.yardId), item, s) } catch {}
}

export async function dropPendingYard(yardId: number): Promise<void> {
  const s = pendingStore()
  if (s) try { await del(yardKey(yardId), s) } catch {}
}

export async function keepVisitNotes(userId: number, visitId: number, notes: string): Promise<void> {
  const s = pendingStore()
  if (!s) throw new Error('This browser cannot keep notes offline')
  await set(notesKey(visitId), { kind: 'visit-notes', userId, visitId, notes, savedAt: new Date().toISOString() } satisfies PendingVisitNotes, s)
}

export async function keepVisitPhoto(userId: number, visitId: number, file: Blob, name: string, caption: string): Promise<PendingVisitPhoto> {
  const s = pendingStore()
  if (!s) throw new Error('This browser cannot keep photos offline')
  const key = `visit-photo:${visitId}:${Date.now().toString(36)}${Math.random().toString(36).slice(2, 6)}`
  const item: PendingVisitPhoto = { kind: 'visit-photo', userId, visitId, key, caption, name, file, savedAt: new Date().toISOString() }
  await set(key, item, s)
  return item
}

/** Everything waiting for one visit (notes and photos), oldest first. */
export async function pendingForVisit(userId: number, visitId: number): Promise<Array<PendingVisitNotes | PendingVisitPhoto>> {
  const s = pendingStore()
  if (!s) return []
  const all = await entries<string, PendingItem>(s)
  return all.map(([, v]) => v)
    .filter((v): v is PendingVisitNotes | PendingVisitPhoto => v.kind !== 'yard' && v.userId === userId && v.visitId === visitId)
    .sort((a, b) => a.savedAt.localeCompare(b.savedAt))
}

export async function dropPending(key: string): Promise<void> {
  const s = pendingStore()
  if (s) await del(key, s)
}
export { notesKey as pendingNotesKey }
