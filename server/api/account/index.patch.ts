import { eq } from 'drizzle-orm'
import { accountUpdateSchema } from '#shared/types/auth'

/** Change the signed-in user's name or e-mail notification choice. */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readValidatedBody(event, accountUpdateSchema.parse)
  const [u] = await useDb().update(tables.users).set(body).where(eq(tables.users.id, user.id)).returning()
  if (!u) throw httpError(404, 'account_not_found', 'This account no longer exists.')
  if (body.name) await replaceUserSession(event, { user: { ...user, name: u.name }, loggedInAt: Date.now() })
  return { name: u.name, notifyOptOut: u.notifyOptOut }
})
