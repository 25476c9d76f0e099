import { eq } from 'drizzle-orm'
import { accountUpdateSchema } from '#shared/types/auth'

/** Change the signed-in user's name or e-mail notification choice (400 when the body names neither). */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const body = await readValidatedBody(event, accountUpdateSchema.parse)
  if (body.name === undefined && body.notifyOptOut === undefined) throw httpError(400, 'nothing_to_change',
    'Nothing to change: send name and/or notifyOptOut.')
  const [u] = await useDb().update(tables.users).set(body).where(eq(tables.users.id, user.id)).returning()
  if (!u) throw httpError(404, 'account_not_found', 'This account no longer exists.')
  // setUserSession merges, so the session's server-side key (sessions.ts) stays.
  if (body.name) await setUserSession(event, { user: { ...user, name: u.name } })
  return { name: u.name, notifyOptOut: u.notifyOptOut }
})
