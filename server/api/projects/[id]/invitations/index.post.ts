import { and, eq, isNull } from 'drizzle-orm'
import { projectParamsSchema } from '#shared/types/projects'
import { invitationCreateSchema, type InvitationItem } from '#shared/types/team'
import { invitationMail } from '~~/server/mail/templates'
import { enqueueMail } from '~~/server/mail/outbox'
import { linkLifetimes, mailSettings } from '~~/server/mail/config'

/** Invite an address to the project with a role (owners only); replaces an earlier pending invitation. */
export default defineEventHandler(async (event): Promise<InvitationItem> => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  const { user, project } = await requireProjectRole(event, id, 'owner')
  const { email, role } = await readValidatedBody(event, invitationCreateSchema.parse)
  const { invitations: i, memberships: m, users: u } = tables
  const db = useDb()
  const member = await db.select({ role: m.role }).from(m).innerJoin(u,
    eq(u.id, m.userId)).where(and(eq(m.projectId, id), eq(u.email, email))).get()
  if (member) throw httpError(409, 'already_member',
    `${email} is already a member of this project (${member.role}). Change their role in the member list instead.`)
  const token = newSecret()
  const expiresAt = new Date(Date.now() + linkLifetimes().invitationMs)
  // the open invitations of this address end and the new one starts together
  const [, [row]] = await db.batch([
    db.update(i).set({ revokedAt: new Date() }).where(and(eq(i.projectId, id), eq(i.email, email),
      isNull(i.acceptedAt), isNull(i.revokedAt))),
    db.insert(i).values({ projectId: id, email, role, tokenHash: hashToken(token), expiresAt,
      invitedBy: user.id }).returning(),
  ])
  const url = `${mailSettings().baseUrl}/invitations/${token}`
  await enqueueMail({ to: email, kind: 'invitation', secretUrl: url,
    ...invitationMail({ projectName: project.name, inviterName: user.name, role, url, expiresAt }) })
  await logActivity({ projectId: id, actorId: user.id, verb: 'invited', objectType: 'invitation', objectId: row!.id,
    data: { email, role } })
  setResponseStatus(event, 201)
  return { id: row!.id, email, role, state: 'pending', invitedBy: user.name, expiresAt: expiresAt.toISOString(),
    createdAt: row!.createdAt.toISOString() }
})
