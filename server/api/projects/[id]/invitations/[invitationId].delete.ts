import { and, eq, isNull } from 'drizzle-orm'
import { invitationParamsSchema } from '#shared/types/team'

/** Withdraw a pending invitation (owners only); its link stops working. */
export default defineEventHandler(async (event) => {
  const { id, invitationId } = await getValidatedRouterParams(event, invitationParamsSchema.parse)
  const { user } = await requireProjectRole(event, id, 'owner')
  const i = tables.invitations
  const [row] = await useDb().update(i).set({ revokedAt: new Date() })
    .where(and(eq(i.id, invitationId), eq(i.projectId, id), isNull(i.acceptedAt), isNull(i.revokedAt))).returning()
  if (!row) throw httpError(404, 'invitation_not_found', 'No pending invitation with this id in this project.')
  await logActivity({ projectId: id, actorId: user.id, verb: 'withdrew invitation', objectType: 'invitation',
    objectId: row.id, data: { email: row.email } })
  return { ok: true }
})
