import { desc, eq } from 'drizzle-orm'
import type { TokenItem } from '#shared/types/team'

/** The signed-in user's API tokens (never the tokens themselves). Session only. */
export default defineEventHandler(async (event): Promise<TokenItem[]> => {
  const user = await requireSessionUser(event)
  const t = tables.apiTokens
  const rows = await useDb().select().from(t).where(eq(t.userId, user.id)).orderBy(desc(t.createdAt), desc(t.id))
  return rows.map(toTokenItem)
})
