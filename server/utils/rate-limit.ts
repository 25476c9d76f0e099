/**
 * Rate limits of sign-in and password-reset requests, kept in `sign_in_failures` (so they survive
 * restarts and hold across processes). Rules:
 * - only failures count for sign-in: a correct password is never refused because of other
 *   accounts' failures;
 * - per account (e-mail): `signInLimit.perAccount` failures within `windowMinutes` → 429 for that
 *   account only;
 * - per client address: no lock, a growing delay before each attempt is checked — none for the
 *   first `freeAddressFailures` failures, then `delayBaseMs · 2^(n − free)` up to `delayMaxMs`
 *   (OWASP Authentication Cheat Sheet, "Login Throttling", common practice);
 * - password-reset requests are counted apart (`resetLimit`), never as sign-in failures.
 * Config keys: NUXT_SIGN_IN_LIMIT_* and NUXT_RESET_LIMIT_* (README, docs/security.md).
 */
import type { H3Event } from 'h3'
import { and, count, eq, gt, lt } from 'drizzle-orm'

/** The client address used for limiting (X-Forwarded-For only when `trustProxy` is on). */
export function clientAddress(event: H3Event): string {
  return getRequestIP(event, { xForwardedFor: !!useRuntimeConfig().trustProxy }) ?? 'unknown'
}

type Kind = 'sign-in' | 'reset'

async function recent(kind: Kind, by: 'email' | 'ip', value: string, windowMinutes: number): Promise<number> {
  const f = tables.signInFailures
  const since = new Date(Date.now() - windowMinutes * 60_000)
  const [row] = await useDb().select({ n: count() }).from(f).where(and(eq(f.kind, kind),
    eq(by === 'email' ? f.email : f.ip, value), gt(f.createdAt, since)))
  return row!.n
}

async function record(kind: Kind, email: string, ip: string, windowMinutes: number): Promise<void> {
  const f = tables.signInFailures
  const db = useDb()
  await db.insert(f).values({ email, ip, kind })
  await db.delete(f).where(and(eq(f.kind, kind), lt(f.createdAt, new Date(Date.now() - windowMinutes * 60_000))))
}

/** Delay in ms for an address with `failures` recent sign-in failures (see file header). */
export function addressDelayMs(failures: number, free: number, baseMs: number, maxMs: number): number {
  if (failures < free) return 0
  return Math.min(maxMs, baseMs * 2 ** Math.min(30, failures - free))
}

/**
 * Before checking a password: 429 when this account has too many recent failures; otherwise wait
 * the address's delay (also sent as `X-Sign-In-Delay-Ms`).
 */
export async function throttleSignIn(event: H3Event, email: string, ip: string): Promise<void> {
  const { perAccount, windowMinutes, freeAddressFailures, delayBaseMs, delayMaxMs } = useRuntimeConfig().signInLimit
  if (await recent('sign-in', 'email', email, windowMinutes) >= perAccount) {
    throw httpError(429, 'too_many_attempts',
      `Too many failed sign-ins for this account. Wait ${windowMinutes} minutes and try again, or reset the password.`)
  }
  const delay = addressDelayMs(await recent('sign-in', 'ip', ip, windowMinutes), freeAddressFailures, delayBaseMs,
    delayMaxMs)
  setResponseHeader(event, 'x-sign-in-delay-ms', String(delay))
  if (delay > 0) await new Promise(resolve => setTimeout(resolve, delay))
}

/** Record one failed sign-in (and drop records older than the window). */
export function recordSignInFailure(email: string, ip: string): Promise<void> {
  return record('sign-in', email, ip, useRuntimeConfig().signInLimit.windowMinutes)
}

/** Forget an account's sign-in failures after a successful sign-in or a password reset. */
export async function clearSignInFailures(email: string): Promise<void> {
  const f = tables.signInFailures
  await useDb().delete(f).where(and(eq(f.kind, 'sign-in'), eq(f.email, email)))
}

/** Count a password-reset request; 429 past the per-account or per-address reset limit. */
export async function limitResetRequest(email: string, ip: string): Promise<void> {
  const { perAccount, perAddress, windowMinutes } = useRuntimeConfig().resetLimit
  if (await recent('reset', 'email', email, windowMinutes) >= perAccount || await recent('reset', 'ip', ip,
    windowMinutes) >= perAddress) {
    throw httpError(429, 'too_many_reset_requests',
      `Too many password-reset requests. Wait ${windowMinutes} minutes, or use the link already sent.`)
  }
  await record('reset', email, ip, windowMinutes)
}
