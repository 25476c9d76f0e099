import { eq } from 'drizzle-orm'
import { signUpSchema } from '#shared/types/auth'

/** Create an account (when an admin has not switched sign-up off) and sign it in. */
export default defineEventHandler(async (event) => {
  if (!(await isSignupEnabled())) throw httpError(403, 'signup_closed',
    'Sign-up is switched off on this server. Ask an administrator for an account.')
  const { name, email, password } = await readValidatedBody(event, signUpSchema.parse)
  const db = useDb()
  const taken = await db.query.users.findFirst({ where: eq(tables.users.email, email), columns: { id: true } })
  if (taken) throw httpError(409, 'email_taken', 'An account with this e-mail address already exists.')
  const [user] = await db.insert(tables.users)
    .values({ name, email, passwordHash: await hashPassword(password), siteRole: 'member' })
    .returning({ id: tables.users.id, email: tables.users.email, name: tables.users.name,
      siteRole: tables.users.siteRole })
  await startSession(event, user!)
  setResponseStatus(event, 201)
  return { user: user! }
})
