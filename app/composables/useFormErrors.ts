import { ref } from 'vue'
import type { ZodType } from 'zod'

/**
 * Client-side validation with the same zod schema the route uses.
 * `validate(state)` fills `errors` (first message per field) and returns the parsed data or null.
 */
export function useFormErrors<T>(schema: ZodType<T>) {
  const errors = ref<Record<string, string>>({})
  function validate(state: unknown): T | null {
    const result = schema.safeParse(state)
    errors.value = {}
    if (result.success) return result.data
    for (const issue of result.error.issues) {
      const key = String(issue.path[0] ?? '_')
      errors.value[key] ??= issue.message
    }
    return null
  }
  return { errors, validate }
}

/**
 * A form's submit cycle: validate `state` with `schema`, then run `action` with the parsed data,
 * tracking `busy` and turning a failed request into `serverError`.
 */
export function useFormSubmit<T>(schema: ZodType<T>, state: object, action: (data: T) => Promise<unknown>) {
  const { errors, validate } = useFormErrors(schema)
  const serverError = ref('')
  const busy = ref(false)
  async function submit() {
    serverError.value = ''
    const data = validate(state)
    if (!data) return
    busy.value = true
    try { await action(data) }
    catch (e) { serverError.value = apiErrorMessage(e) }
    finally { busy.value = false }
  }
  return { errors, serverError, busy, submit }
}

/**
 * A readable message from a failed `$fetch` (the server's `message`, else a generic one). A zod
 * validation failure (h3 puts the issues as a JSON string in `message`) becomes its issue messages.
 */
export function apiErrorMessage(error: unknown): string {
  const e = error as { data?: { message?: string, data?: { name?: string, message?: string } }, statusCode?: number, message?: string }
  const zod = e?.data?.data?.name === 'ZodError' ? zodIssueMessages(e.data.data.message) : ''
  if (zod) return zod
  if (e?.data?.message) return e.data.message
  if (e?.statusCode === undefined) return 'The server could not be reached. Check your connection and try again.'
  return e.message || 'Something went wrong.'
}

/** The issue messages of a serialised ZodError (`[{ message, … }, …]`), joined; '' if it is not one. */
function zodIssueMessages(json: string | undefined): string {
  try {
    const issues = JSON.parse(json ?? '') as Array<{ message?: unknown }>
    return Array.isArray(issues) ? [...new Set(issues.map(i => String(i?.message ?? '')).filter(Boolean))].join(' ') : ''
  }
  catch { return '' }
}
