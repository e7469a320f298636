// The service worker's caches (names match the runtime caching in nuxt.config.ts) and which pages are kept.
export const OFFLINE_PAGE_CACHE = 'ww-pages'
export const OFFLINE_API_CACHE = 'ww-api'

/** Pages worth opening again without a network: the yard list, a yard's editor, a site visit. */
export function keepsOffline(path: string): boolean {
  return /^\/(yards|yards\/\d+|visits\/\d+)(\?.*)?$/.test(path)
}

/** On signing out nothing of the account stays readable in the browser's caches. */
export async function clearOfflineCaches() {
  if (typeof caches === 'undefined') return
  await Promise.all([caches.delete(OFFLINE_PAGE_CACHE), caches.delete(OFFLINE_API_CACHE)]).catch(() => {})
}
