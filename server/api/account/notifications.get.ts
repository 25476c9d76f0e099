import { eq } from 'drizzle-orm'

/** Whether the signed-in user receives notice e-mails. */
export default defineEventHandler(async (event) => {
  const user = await requireUser(event)
  const row = await useDb().query.users.findFirst({ where: eq(tables.users.id, user.id),
    columns: { notifyOptOut: true } })
  return { notifyOptOut: row?.notifyOptOut ?? false }
})
