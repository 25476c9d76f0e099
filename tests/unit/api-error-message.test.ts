import { describe, expect, it } from 'vitest'
import { apiErrorCode, apiErrorMessage } from '../../app/composables/useFormErrors'

// What ofetch's FetchError carries for our httpError (h3 body in `data`, status in `statusCode`)
const refused = (statusCode: number, message: string, code?: string) => ({
  statusCode, message: `[POST] "/api/x": ${statusCode} Server Error`,
  data: { statusCode, statusMessage: 'Server Error', message, data: code ? { code } : undefined },
})

describe('messages of refused requests', () => {
  it('shows the server\'s own sentence for a 4xx', () => {
    expect(apiErrorMessage(refused(401, 'Wrong e-mail or password.', 'bad_credentials'))).toBe('Wrong e-mail or password.')
    expect(apiErrorCode(refused(403, 'This needs the editor role in this project; you are a viewer.', 'role_too_low'))).toBe('role_too_low')
  })
  it('never shows "Server Error" or the transport text', () => {
    for (const status of [401, 403, 429, 500, 502]) {
      const m = apiErrorMessage(refused(status, 'Server Error'))
      expect(m).not.toMatch(/Server Error|\[POST\]/)
      expect(m.length).toBeGreaterThan(10)
    }
    expect(apiErrorMessage({ statusCode: 500, message: '[GET] "/api/y": 500 Server Error' })).toMatch(/^The server failed/)
  })
  it('joins zod issues, and says when the server could not be reached', () => {
    const zod = { statusCode: 400, data: { message: 'x', data: { name: 'ZodError', message: JSON.stringify([{ message: 'Enter an e-mail address.' }, { message: 'Enter an e-mail address.' }]) } } }
    expect(apiErrorMessage(zod)).toBe('Enter an e-mail address.')
    expect(apiErrorMessage(new TypeError('fetch failed'))).toMatch(/could not be reached/)
    expect(apiErrorCode(new Error('x'))).toBe('')
  })
})
