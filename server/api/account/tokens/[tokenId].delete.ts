import { and, eq, isNull } from 'drizzle-orm'
import { tokenIdParamsSchema } from '#shared/types/team'

/** Revoke one of the signed-in user's API tokens. Session only. */
export default defineEventHandler(async (event) => {
  const user = await requireSessionUser(event)
  const { tokenId } = await getValidatedRouterParams(event, tokenIdParamsSchema.parse)
  const t = tables.apiTokens
  const rows = await useDb().update(t).set({ revokedAt: new Date() })
    .where(and(eq(t.id, tokenId), eq(t.userId, user.id), isNull(t.revokedAt))).returning({ id: t.id })
  if (!rows.length) throw httpError(404, 'token_not_found', 'No active token with this id on your account.')
  return { ok: true }
})
