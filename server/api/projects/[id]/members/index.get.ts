import { eq } from 'drizzle-orm'
import { projectParamsSchema } from '#shared/types/projects'
import type { MemberItem } from '#shared/types/api'

/** Members of a project (any member may see them). */
export default defineEventHandler(async (event): Promise<MemberItem[]> => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  await requireProjectRole(event, id, 'viewer')
  const { memberships: m, users: u } = tables
  const rows = await useDb()
    .select({ userId: u.id, name: u.name, email: u.email, role: m.role, joinedAt: m.createdAt })
    .from(m).innerJoin(u, eq(u.id, m.userId))
    .where(eq(m.projectId, id))
    .orderBy(u.name)
  return rows.map(r => ({ ...r, joinedAt: r.joinedAt.toISOString() }))
})
