import { count, eq } from 'drizzle-orm'
import type { AdminUserItem } from '#shared/types/api'

/** Every account with its number of project memberships, for site administrators. */
export default defineEventHandler(async (event): Promise<AdminUserItem[]> => {
  await requireAdmin(event)
  const { users: u, memberships: m } = tables
  const rows = await useDb()
    .select({ id: u.id, name: u.name, email: u.email, siteRole: u.siteRole, createdAt: u.createdAt,
      projectCount: count(m.id) })
    .from(u).leftJoin(m, eq(m.userId, u.id))
    .groupBy(u.id)
    .orderBy(u.name)
  return rows.map(r => ({ ...r, createdAt: r.createdAt.toISOString() }))
})
