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

/** Plain sentences for a refused request whose body carries no message of ours (never "Server Error"). */
const STATUS_MESSAGES: Record<number, string> = {
  400: 'The request was not valid.',
  401: 'Sign in first (or sign in again: the session has ended).',
  403: 'You do not have the rights to do this.',
  404: 'Not found, or you do not have access to it.',
  409: 'This conflicts with a change made meanwhile; reload and try again.',
  413: 'This is too large for the server.',
  429: 'Too many attempts. Wait a moment, then try again.',
}

/**
 * A readable message from a failed `$fetch` (the server's `message`, else a sentence for the status).
 * A zod validation failure (h3 puts the issues as a JSON string in `message`) becomes its issue
 * messages. Never the transport's own text ("[POST] /api/…: 401 Server Error").
 */
export function apiErrorMessage(error: unknown): string {
  const e = error as { data?: { message?: string, data?: { name?: string, message?: string } }, statusCode?: number, message?: string }
  const zod = e?.data?.data?.name === 'ZodError' ? zodIssueMessages(e.data.data.message) : ''
  if (zod) return zod
  const own = e?.data?.message
  if (own && own !== 'Server Error') return own
  if (e?.statusCode === undefined) return 'The server could not be reached. Check your connection and try again.'
  if (STATUS_MESSAGES[e.statusCode]) return STATUS_MESSAGES[e.statusCode]!
  return e.statusCode >= 500 ? 'The server failed to answer. Try again in a moment; if it keeps failing, tell an administrator.' : 'Something went wrong.'
}

/** The machine code a refused request carries (`data.code` of our `httpError`), or ''. */
export function apiErrorCode(error: unknown): string {
  const code = (error as { data?: { data?: { code?: unknown } } })?.data?.data?.code
  return typeof code === 'string' ? code : ''
}

/** The issue messages of a serialised ZodError (`[{ message, … }, …]`), joined; '' if it is not one. */
function zodIssueMessages(json: string | undefined): string {
  try {
    const issues = JSON.parse(json ?? '') as Array<{ message?: unknown }>
    return Array.isArray(issues) ? [...new Set(issues.map(i => String(i?.message ?? '')).filter(Boolean))].join(' ') : ''
  }
  catch { return '' }
}
