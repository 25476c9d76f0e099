import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest'
import { frameThrottle } from '../../../app/utils/frame-throttle'

// Behaviour of a trailing throttle (common practice, e.g. the "throttle" of event-driven UIs):
// a burst of calls gives one call; calls spread over time give at most one per interval; the
// last call of a burst is never lost.
describe('frameThrottle', () => {
  beforeEach(() => { vi.useFakeTimers({ toFake: ['setTimeout', 'clearTimeout', 'performance', 'requestAnimationFrame', 'cancelAnimationFrame'] }) })
  afterEach(() => { vi.useRealTimers() })

  it('coalesces a burst into one call and spaces later calls by the interval', () => {
    const fn = vi.fn()
    const t = frameThrottle(fn, 200)
    for (let k = 0; k < 25; k++) t.schedule()
    expect(fn).not.toHaveBeenCalled()
    vi.advanceTimersByTime(50)
    expect(fn).toHaveBeenCalledTimes(1)
    // a batch every 40 ms for 2 s: about 2000 / 200 = 10 calls, never one per batch (50)
    for (let k = 0; k < 50; k++) { t.schedule(); vi.advanceTimersByTime(40) }
    vi.advanceTimersByTime(500)
    expect(fn.mock.calls.length).toBeGreaterThanOrEqual(9)
    expect(fn.mock.calls.length).toBeLessThanOrEqual(12)
  })

  it('flush runs a pending call at once; cancel drops it', () => {
    const fn = vi.fn()
    const t = frameThrottle(fn, 200)
    t.schedule(); t.flush()
    expect(fn).toHaveBeenCalledTimes(1)
    t.flush() // nothing pending
    expect(fn).toHaveBeenCalledTimes(1)
    t.schedule(); t.cancel()
    vi.advanceTimersByTime(1000)
    expect(fn).toHaveBeenCalledTimes(1)
  })
})
