/**
 * Turns our one error shape (`{ message, data: { fields } }`) into a message per field, so forms show the
 * server's words next to the field and keep what was typed.
 */
export function useFormErrors() {
  const fields = ref<Record<string, string>>({})
  const message = ref('')

  function clear() {
    fields.value = {}
    message.value = ''
  }

  function take(error: unknown) {
    const e = error as { data?: { message?: string; data?: { fields?: Record<string, string> } }; message?: string; statusCode?: number }
    fields.value = e.data?.data?.fields ?? {}
    message.value = e.data?.message ?? e.message ?? 'Something went wrong'
    if (!e.data && !e.statusCode) message.value = 'Could not reach Wildward. Check your connection and try again.'
  }

  const of = (name: string) => fields.value[name]

  return { fields, message, clear, take, of }
}
