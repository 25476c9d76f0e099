import { desc, eq } from 'drizzle-orm'
import { projectParamsSchema } from '#shared/types/projects'
import type { InvitationItem } from '#shared/types/team'

/** The project's invitations, newest first, with their state (owners only). */
export default defineEventHandler(async (event): Promise<InvitationItem[]> => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  await requireProjectRole(event, id, 'owner')
  const { invitations: i, users: u } = tables
  const rows = await useDb().select({ invitation: i, invitedBy: u.name })
    .from(i).leftJoin(u, eq(u.id, i.invitedBy)).where(eq(i.projectId, id)).orderBy(desc(i.createdAt), desc(i.id))
  return rows.map(({ invitation: r, invitedBy }) => ({
    id: r.id, email: r.email, role: r.role, state: invitationState(r), invitedBy,
    expiresAt: r.expiresAt.toISOString(), createdAt: r.createdAt.toISOString(),
  }))
})
