/**
 * nuxt-auth-utils' own `DELETE /api/_auth/session` (useUserSession().clear()) clears only the
 * cookie: end the stored session too, so a copy of the cookie stops working (server/utils/sessions.ts).
 */
import { eq } from 'drizzle-orm'

export default defineNitroPlugin(() => {
  sessionHooks.hook('clear', async (session) => {
    const key = (session as { secure?: { sessionKey?: string } }).secure?.sessionKey
    if (key) await useDb().delete(tables.sessions).where(eq(tables.sessions.keyHash, hashToken(key)))
  })
})
