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

  const busy = ref(false)

  /** Checks a form with the same zod schema the server uses; on failure fills the fields and answers undefined. */
  function check<T>(schema: { safeParse(v: unknown): { success: true; data: T } | { success: false; error: { issues: Array<{ path: PropertyKey[]; message: string }> } } }, value: unknown): T | undefined {
    clear()
    const parsed = schema.safeParse(value)
    if (parsed.success) return parsed.data
    fields.value = Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message]))
    return undefined
  }

  /** Runs a submit: busy while it runs, a failure becomes messages beside the fields; true when it worked. */
  async function run(submit: () => Promise<unknown>): Promise<boolean> {
    busy.value = true
    try {
      await submit()
      return true
    } catch (e) {
      take(e)
      return false
    } finally {
      busy.value = false
    }
  }

  return { fields, message, clear, take, of, busy, check, run }
}
