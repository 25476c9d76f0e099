/** Retry delay of the outbox (pure, so the unit tests import it without Nitro). */

/** Delay before attempt number `attempts + 1`, in ms: retrySeconds · 2^(attempts − 1). */
export function backoffMs(attempts: number, retrySeconds: number): number {
  return retrySeconds * 1000 * 2 ** Math.max(0, attempts - 1)
}
