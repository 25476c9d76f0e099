import { eq } from 'drizzle-orm'
import { tokenParamsSchema, type InvitationPreview } from '#shared/types/team'

/** What an invitation link offers (public: the link itself is the secret). */
export default defineEventHandler(async (event): Promise<InvitationPreview> => {
  const { token } = await getValidatedRouterParams(event, tokenParamsSchema.parse)
  const { invitation, projectName, inviterName } = await openInvitation(token)
  const account = await useDb().query.users.findFirst({ where: eq(tables.users.email, invitation.email),
    columns: { id: true } })
  return { projectName, role: invitation.role, email: invitation.email, inviterName, accountExists: !!account,
    expiresAt: invitation.expiresAt.toISOString() }
})
