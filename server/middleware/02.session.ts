/**
 * Every request with a session cookie: the session must still have its row (server/utils/sessions.ts);
 * a signed-out, replaced or expired session is cleared here, so the handler sees no user (401).
 */
export default defineEventHandler(async (event) => {
  if (!getCookie(event, 'nuxt-session')) return
  await checkSession(event)
})
