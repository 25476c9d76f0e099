/** Readable messages from failed API calls, including the validation failures of zod schemas. */
import { describe, expect, it } from 'vitest'
import { z } from 'zod'
import { apiErrorMessage } from '../../../app/composables/useFormErrors'

/**
 * The body a Nitro route answers when `getValidatedRouterParams(event, schema.parse)` throws: h3
 * puts the ZodError's JSON message into `message` and the serialised error into `data` (seen with
 * curl against the built server, e.g. GET /api/invitations/nonsense).
 */
function validationBody(schema: z.ZodType, input: unknown) {
  const error = schema.safeParse(input).error!
  const serialised = JSON.parse(JSON.stringify({ name: error.name, message: error.message }))
  return { statusCode: 400, data: { statusCode: 400, statusMessage: 'Validation Error', message: error.message, data: serialised } }
}

describe('apiErrorMessage', () => {
  it('turns a zod validation failure into its issue messages, not JSON', () => {
    const token = z.object({ token: z.string().regex(/^[a-z]{20}$/, 'This link is not valid.') })
    expect(apiErrorMessage(validationBody(token, { token: 'short' }))).toBe('This link is not valid.')
    const signIn = z.object({ email: z.email('Enter a valid e-mail address.'), password: z.string('Enter your password.') })
    expect(apiErrorMessage(validationBody(signIn, { email: 'x' }))).toBe('Enter a valid e-mail address. Enter your password.')
  })

  it('keeps the server message of other errors and explains a missing server', () => {
    expect(apiErrorMessage({ statusCode: 404, data: { message: 'No such project.', data: { code: 'project_not_found' } } })).toBe('No such project.')
    expect(apiErrorMessage(new TypeError('fetch failed'))).toMatch(/could not be reached/)
  })
})
