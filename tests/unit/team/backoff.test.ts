/** Mail retry schedule: exponential backoff from the configured first delay. */
import { describe, expect, it } from 'vitest'
import { backoffMs } from '../../../server/mail/backoff'

describe('backoffMs', () => {
  it('doubles the delay after each failed attempt (common practice, no source)', () => {
    expect([1, 2, 3, 4, 5].map(n => backoffMs(n, 30))).toEqual([30_000, 60_000, 120_000, 240_000, 480_000])
  })
  it('treats attempt 0 like the first', () => {
    expect(backoffMs(0, 10)).toBe(10_000)
  })
})
