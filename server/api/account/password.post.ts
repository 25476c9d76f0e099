import { eq } from 'drizzle-orm'
import { passwordChangeSchema } from '#shared/types/auth'

/** Change the signed-in user's password (the current one is required); every other session of the account ends. */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { currentPassword, newPassword } = await readValidatedBody(event, passwordChangeSchema.parse)
  const db = useDb()
  const u = await db.query.users.findFirst({ where: eq(tables.users.id, user.id) })
  if (!u || !(await verifyPassword(u.passwordHash, currentPassword))) {
    throw httpError(400, 'bad_current_password', 'The current password is not right.')
  }
  await db.update(tables.users).set({ passwordHash: await hashPassword(newPassword) }).where(eq(tables.users.id,
    user.id))
  await endSessionsOf(user.id, event.context.sessionRowId as number | undefined)
  return { ok: true }
})
