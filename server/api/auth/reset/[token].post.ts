import { and, eq, gt, isNull } from 'drizzle-orm'
import { passwordResetSchema, tokenParamsSchema } from '#shared/types/team'

/**
 * Choose a new password with a reset link (single use; every other open link and every session of
 * the account end too).
 */
export default defineEventHandler(async (event) => {
  const { token } = await getValidatedRouterParams(event, tokenParamsSchema.parse)
  const { password } = await readValidatedBody(event, passwordResetSchema.parse)
  const r = tables.passwordResets
  const db = useDb()
  const now = new Date()
  const [claimed] = await db.update(r).set({ usedAt: now })
    .where(and(eq(r.tokenHash, hashToken(token)), isNull(r.usedAt), gt(r.expiresAt, now))).returning()
  if (!claimed) throw httpError(410, 'reset_link_invalid',
    'This link has expired or has already been used. Ask for a new one.')
  const passwordHash = await hashPassword(password)
  // the account's other open links end and the new password is set together
  const [, [user]] = await db.batch([
    db.update(r).set({ usedAt: now }).where(and(eq(r.userId, claimed.userId), isNull(r.usedAt))),
    db.update(tables.users).set({ passwordHash }).where(eq(tables.users.id, claimed.userId))
      .returning({ email: tables.users.email }),
  ])
  if (user) await clearSignInFailures(user.email)
  await endSessionsOf(claimed.userId)
  return { ok: true }
})
