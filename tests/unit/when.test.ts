import { describe, expect, it } from 'vitest'
import { formatDay, formatWhen } from '../../app/utils/when'

// One date format on every page: day, short month, year ("2 Dec 2026"), the time after a comma.
// The hour depends on the machine's time zone, so only the day part and the shape are checked.
describe('date format', () => {
  it('writes days as "2 Dec 2026" (en-GB medium date: common practice)', () => {
    expect(formatDay('2026-12-02T12:00:00Z')).toBe('2 Dec 2026')
  })
  it('writes date-times as the same day, then the 24-hour time', () => {
    expect(formatWhen('2026-12-02T12:00:00Z')).toMatch(/^2 Dec 2026, \d\d:\d\d$/)
    expect(formatWhen(null)).toBe('—')
    expect(formatWhen(null, 'never')).toBe('never')
  })
})
