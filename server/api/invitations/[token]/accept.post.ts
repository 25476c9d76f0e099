import { eq, sql } from 'drizzle-orm'
import { invitationAcceptSchema, invitationSignUpSchema, tokenParamsSchema } from '#shared/types/team'

/**
 * Accept an invitation: the signed-in user whose address was invited, else the existing account
 * of that address with its password, else a new account (name + password; allowed even when
 * sign-up is closed, since the owner invited this address). Adds the membership and signs in.
 */
export default defineEventHandler(async (event) => {
  const { token } = await getValidatedRouterParams(event, tokenParamsSchema.parse)
  const { invitation } = await openInvitation(token)
  const body = await readValidatedBody(event, invitationAcceptSchema.parse)
  const session = await getUserSession(event)
  if (session.user && session.user.email !== invitation.email) {
    throw httpError(403, 'wrong_account',
      `This invitation is for ${invitation.email}. Sign out, then open the link again.`)
  }
  const db = useDb()
  let user = session.user ?? await db.query.users.findFirst({ where: eq(tables.users.email, invitation.email),
    columns: { id: true, email: true, name: true, siteRole: true } })
  if (user && !session.user) await checkPassword(event, invitation.email, body.password ?? '')
  const signUp = user ? null : invitationSignUpSchema.safeParse(body)
  if (signUp && !signUp.success) throw httpError(400, 'invalid_sign_up', signUp.error.issues[0]!.message)
  if (!(await claimInvitation(invitation.id))) throw httpError(410, 'invitation_used',
    'This invitation has already been used.')
  // a new account, its membership and the activity entry land together (one batch)
  const u = tables.users
  const passwordHash = signUp?.success ? await hashPassword(signUp.data.password) : ''
  const userId = user ? user.id : sql<number>`(SELECT id FROM users WHERE email = ${invitation.email})` as unknown as number
  const membership = db.insert(tables.memberships).values({ projectId: invitation.projectId, userId,
    role: invitation.role }).onConflictDoNothing()
  const joined = activityInsert({
    projectId: invitation.projectId, actorId: userId, verb: 'joined', objectType: 'member', objectId: userId,
    data: { role: invitation.role, invitationId: invitation.id },
  })
  if (signUp?.success) {
    const [[created]] = await db.batch([
      db.insert(u).values({ name: signUp.data.name, email: invitation.email, passwordHash })
        .returning({ id: u.id, email: u.email, name: u.name, siteRole: u.siteRole }),
      membership, joined,
    ])
    user = created!
  }
  else await db.batch([membership, joined])
  if (!session.user) await startSession(event, user!)
  return { projectId: invitation.projectId, role: invitation.role }
})

/** Verify the existing account's password, with the sign-in rate limits. */
async function checkPassword(event: Parameters<typeof clientAddress>[0], email: string, password: string) {
  const ip = clientAddress(event)
  await throttleSignIn(event, email, ip)
  const u = await useDb().query.users.findFirst({ where: eq(tables.users.email, email),
    columns: { passwordHash: true } })
  if (!u || !(await verifyPassword(u.passwordHash, password))) {
    await recordSignInFailure(email, ip)
    throw httpError(401, 'bad_credentials', 'Wrong password for this account.')
  }
}
