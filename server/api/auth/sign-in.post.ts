import { eq } from 'drizzle-orm'
import { signInSchema } from '#shared/types/auth'

/** Sign in with e-mail and password; failures are limited per account and slowed per address (rate-limit.ts). */
export default defineEventHandler(async (event) => {
  const { email, password } = await readValidatedBody(event, signInSchema.parse)
  const ip = clientAddress(event)
  await throttleSignIn(event, email, ip)
  const user = await useDb().query.users.findFirst({ where: eq(tables.users.email, email) })
  if (!user || !(await verifyPassword(user.passwordHash, password))) {
    await recordSignInFailure(email, ip)
    throw httpError(401, 'bad_credentials', 'Wrong e-mail or password.')
  }
  await clearSignInFailures(email)
  const sessionUser = { id: user.id, email: user.email, name: user.name, siteRole: user.siteRole }
  await startSession(event, sessionUser)
  return { user: sessionUser }
})
