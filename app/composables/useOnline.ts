// Whether the browser has a network, from its own online/offline events (true during server rendering).
export function useOnline() {
  const online = useState('browser-online', () => true)
  if (import.meta.client) {
    const update = () => { online.value = navigator.onLine }
    onMounted(() => {
      update()
      window.addEventListener('online', update)
      window.addEventListener('offline', update)
    })
    onBeforeUnmount(() => {
      window.removeEventListener('online', update)
      window.removeEventListener('offline', update)
    })
  }
  return online
}
