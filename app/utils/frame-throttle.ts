/**
 * Coalesces bursts of calls into at most one call of `fn` per `ms` milliseconds, run in an
 * animation frame (trailing: the last burst is never lost). Used on data-update paths that
 * re-render big charts (a run's batches arrive every 40 ms; one chart update per 200 ms keeps each
 * main-thread task short). `flush()` runs a pending call now; `cancel()` drops it.
 * Own code: a dozen lines, against a utility package for one function.
 */
export function frameThrottle(fn: () => void, ms = 200): { schedule: () => void, flush: () => void, cancel: () => void } {
  let timer: ReturnType<typeof setTimeout> | undefined
  let frame: number | undefined
  let last = -Infinity
  let pending = false
  const run = () => { timer = undefined; frame = undefined; if (!pending) return; pending = false; last = performance.now(); fn() }
  const inFrame = () => { frame = typeof requestAnimationFrame === 'function' ? requestAnimationFrame(run) : undefined; if (frame === undefined) run() }
  return {
    schedule() {
      pending = true
      if (timer !== undefined || frame !== undefined) return
      timer = setTimeout(inFrame, Math.max(0, last + ms - performance.now()))
    },
    flush() {
      if (timer !== undefined) clearTimeout(timer)
      if (frame !== undefined && typeof cancelAnimationFrame === 'function') cancelAnimationFrame(frame)
      run()
    },
    cancel() {
      pending = false
      if (timer !== undefined) clearTimeout(timer)
      if (frame !== undefined && typeof cancelAnimationFrame === 'function') cancelAnimationFrame(frame)
      timer = undefined; frame = undefined
    },
  }
}
