import { sql } from 'drizzle-orm'
import type { AdminUserItem } from '#shared/types/api'

/** Every account, for site administrators. */
export default defineEventHandler(async (event): Promise<AdminUserItem[]> => {
  await requireAdmin(event)
  const u = tables.users
  const rows = await useDb()
    .select({
      id: u.id, name: u.name, email: u.email, siteRole: u.siteRole, createdAt: u.createdAt,
      projectCount: sql<number>`(select count(*) from memberships m where m.user_id = ${u.id})`,
    })
    .from(u).orderBy(u.name)
  return rows.map(r => ({ ...r, createdAt: r.createdAt.toISOString() }))
})
