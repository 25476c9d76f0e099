/**
 * Rate limiting of failed sign-ins, per account (e-mail) and per client address, over a sliding
 * window. Failures are stored in `sign_in_failures`, so limits survive restarts. Limits come from
 * runtime config `signInLimit` (NUXT_SIGN_IN_LIMIT_PER_ACCOUNT, …_PER_ADDRESS, …_WINDOW_MINUTES).
 */
import type { H3Event } from 'h3'
import { and, count, eq, gt, lt } from 'drizzle-orm'

/** The client address used for limiting (X-Forwarded-For only when `trustProxy` is on). */
export function clientAddress(event: H3Event): string {
  return getRequestIP(event, { xForwardedFor: !!useRuntimeConfig().trustProxy }) ?? 'unknown'
}

/** Throw a 429 when the account or the address has too many recent failures. */
export async function assertSignInAllowed(email: string, ip: string): Promise<void> {
  const { perAccount, perAddress, windowMinutes } = useRuntimeConfig().signInLimit
  const since = new Date(Date.now() - windowMinutes * 60_000)
  const f = tables.signInFailures
  const db = useDb()
  const [byAccount] = await db.select({ n: count() }).from(f).where(and(eq(f.email, email), gt(f.createdAt, since)))
  const [byAddress] = await db.select({ n: count() }).from(f).where(and(eq(f.ip, ip), gt(f.createdAt, since)))
  if (byAccount!.n >= perAccount || byAddress!.n >= perAddress) {
    throw httpError(429, 'too_many_attempts', `Too many failed sign-ins. Wait ${windowMinutes} minutes and try again, or ask an administrator.`)
  }
}

/** Record one failed attempt (and drop records older than the window). */
export async function recordSignInFailure(email: string, ip: string): Promise<void> {
  const { windowMinutes } = useRuntimeConfig().signInLimit
  const f = tables.signInFailures
  const db = useDb()
  await db.insert(f).values({ email, ip })
  await db.delete(f).where(lt(f.createdAt, new Date(Date.now() - windowMinutes * 60_000)))
}

/** Forget an account's failures after a successful sign-in. */
export async function clearSignInFailures(email: string): Promise<void> {
  const f = tables.signInFailures
  await useDb().delete(f).where(eq(f.email, email))
}
