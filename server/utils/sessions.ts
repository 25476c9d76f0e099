/**
 * Server-side session identity. The sealed cookie (nuxt-auth-utils) carries a random session key
 * in its server-only `secure` part; `sessions` stores its SHA-256 with the user, the client and
 * the last time it was seen. server/middleware/02.session.ts checks it on every request that has
 * a cookie, so ending a row ends the session everywhere at once:
 * - sign-out ends that session; a password change ends every other session of the account; a
 *   password reset and "sign out everywhere" end all of them;
 * - a session unseen for `sessionLifetime.idleMinutes` or older than `absoluteHours` is ended
 *   (NUXT_SESSION_LIFETIME_IDLE_MINUTES, NUXT_SESSION_LIFETIME_ABSOLUTE_HOURS).
 */
import type { H3Event } from 'h3'
import { and, eq, ne } from 'drizzle-orm'

/** How often `last_seen_at` is refreshed at most (one write per minute per session). */
const SEEN_RESOLUTION_MS = 60_000

interface SessionUser { id: number, email: string, name: string, siteRole: 'admin' | 'member' }

/** Sign `user` in on this request: a new session row and a cookie carrying its key. */
export async function startSession(event: H3Event, user: SessionUser): Promise<void> {
  await endCurrentSession(event)
  const key = newSecret()
  await useDb().insert(tables.sessions).values({
    userId: user.id, keyHash: hashToken(key),
    userAgent: (getRequestHeader(event, 'user-agent') ?? '').slice(0, 300), ip: clientAddress(event),
  })
  await replaceUserSession(event,
    { user: { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole }, secure: { sessionKey: key },
    loggedInAt: Date.now() })
}

/** The stored session row of this request's cookie, if it is still alive (else the cookie is cleared). */
export async function checkSession(event: H3Event) {
  const session = await getUserSession(event)
  if (!session.user) return null
  const key = session.secure?.sessionKey
  const s = tables.sessions
  const row = key ? await useDb().query.sessions.findFirst({ where: eq(s.keyHash, hashToken(key)) }) : undefined
  const { idleMinutes, absoluteHours } = useRuntimeConfig().sessionLifetime
  const now = Date.now()
  const expired = row && (now - row.lastSeenAt.getTime() > idleMinutes * 60_000 || now - row.createdAt.getTime() > absoluteHours * 3_600_000)
  if (!row || expired || row.userId !== session.user.id) {
    if (row) await useDb().delete(s).where(eq(s.id, row.id))
    await clearUserSession(event)
    forgetRequestCookie(event)
    return null
  }
  if (now - row.lastSeenAt.getTime() > SEEN_RESOLUTION_MS) await useDb().update(s).set({ lastSeenAt: new Date(now) }).where(eq(s.id, row.id))
  event.context.sessionRowId = row.id
  return row
}

/**
 * Remove the session cookie from this request's headers: h3 reads the cookie again whenever the
 * session is asked for, so a cleared session would otherwise come back from the request.
 */
function forgetRequestCookie(event: H3Event): void {
  const header = event.node.req.headers.cookie
  if (!header) return
  event.node.req.headers.cookie = header.split(';').filter(part => part.trim().split('=')[0] !== 'nuxt-session').join(';')
}

/** End this request's session (sign-out) and clear its cookie. */
export async function endCurrentSession(event: H3Event): Promise<void> {
  const session = await getUserSession(event)
  const key = session.secure?.sessionKey
  if (key) await useDb().delete(tables.sessions).where(eq(tables.sessions.keyHash, hashToken(key)))
  await clearUserSession(event)
}

/** End every session of `userId`, except the row `keepId` when given. */
export async function endSessionsOf(userId: number, keepId?: number): Promise<void> {
  const s = tables.sessions
  await useDb().delete(s).where(keepId ? and(eq(s.userId, userId), ne(s.id, keepId)) : eq(s.userId, userId))
}
