import { eq, sql } from 'drizzle-orm'
import type { ProjectListItem } from '#shared/types/api'

/** Projects the signed-in user belongs to, with their role and counts. */
export default defineEventHandler(async (event): Promise<ProjectListItem[]> => {
  const user = await requireUser(event)
  const { projects: p, memberships: m } = tables
  const rows = await useDb()
    .select({
      id: p.id, name: p.name, description: p.description, role: m.role, updatedAt: p.updatedAt,
      memberCount: sql<number>`(select count(*) from memberships mm where mm.project_id = ${p.id})`,
      graphCount: sql<number>`(select count(*) from graphs g where g.project_id = ${p.id})`,
    })
    .from(p).innerJoin(m, eq(m.projectId, p.id))
    .where(eq(m.userId, user.id))
    .orderBy(p.name)
  return rows.map(r => ({ ...r, updatedAt: r.updatedAt.toISOString() }))
})
