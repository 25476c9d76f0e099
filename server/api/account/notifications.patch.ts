import { eq } from 'drizzle-orm'
import { notificationsSchema } from '#shared/types/team'

/** Turn notice e-mails (run verified/rejected, comments on your runs) off or on. */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const { notifyOptOut } = await readValidatedBody(event, notificationsSchema.parse)
  await useDb().update(tables.users).set({ notifyOptOut }).where(eq(tables.users.id, user.id))
  return { notifyOptOut }
})
