// The service worker (built by @vite-pwa/nuxt into /sw.js) is registered once the page has loaded and the
// browser is idle, so a first visit on a slow connection loads its own files first. Pages a visit needs again
// offline (the yards, a yard, a site visit) are put in the worker's page cache when opened: the first opening
// and in-app navigation do not pass through the worker's page cache by themselves.
import { OFFLINE_PAGE_CACHE, keepsOffline } from '~/utils/offline-pages'

export default defineNuxtPlugin((nuxtApp) => {
  if (import.meta.dev || !('serviceWorker' in navigator) || !('caches' in window)) return
  const controlledAtLoad = !!navigator.serviceWorker.controller
  const idle = (fn: () => void) => ('requestIdleCallback' in window ? window.requestIdleCallback(fn, { timeout: 4000 }) : setTimeout(fn, 1000))

  const register = () => idle(() => { navigator.serviceWorker.register('/sw.js', { scope: '/' }).catch(() => {}) })
  if (document.readyState === 'complete') register()
  else window.addEventListener('load', register, { once: true })

  async function keep(path: string) {
    if (!navigator.onLine || !keepsOffline(path)) return
    await navigator.serviceWorker.ready
    const cache = await caches.open(OFFLINE_PAGE_CACHE)
    // a fresh copy as the server renders it now (the session cookie goes along: same origin)
    await cache.add(new Request(path, { credentials: 'same-origin' })).catch(() => {})
  }
  let first = true
  nuxtApp.hook('page:finish', () => {
    const path = useRouter().currentRoute.value.fullPath
    const initial = first
    first = false
    // a first load the worker controlled was put in its page cache by the worker itself
    if (initial && controlledAtLoad) return
    idle(() => { keep(path) })
  })
})
