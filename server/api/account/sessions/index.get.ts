import { desc, eq } from 'drizzle-orm'
import type { SessionItem } from '#shared/types/sessions'

/** The signed-in user's active sessions, most recently seen first; `current` marks this one. */
export default defineEventHandler(async (event): Promise<SessionItem[]> => {
  const user = await requireSessionUser(event)
  const s = tables.sessions
  const rows = await useDb().select().from(s).where(eq(s.userId, user.id)).orderBy(desc(s.lastSeenAt))
  return rows.map(r => ({
    id: r.id, userAgent: r.userAgent, ip: r.ip, current: r.id === event.context.sessionRowId,
    createdAt: r.createdAt.toISOString(), lastSeenAt: r.lastSeenAt.toISOString(),
  }))
})
