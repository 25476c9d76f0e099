import { eq } from 'drizzle-orm'
import type { AccountInfo } from '#shared/types/api'

/** The signed-in user's account. */
export default defineEventHandler(async (event): Promise<AccountInfo> => {
  const { id } = await requireUser(event)
  const u = await useDb().query.users.findFirst({ where: eq(tables.users.id, id) })
  if (!u) throw httpError(404, 'account_not_found', 'This account no longer exists.')
  return { id: u.id, name: u.name, email: u.email, siteRole: u.siteRole, notifyOptOut: u.notifyOptOut,
    createdAt: u.createdAt.toISOString() }
})
