/** Sign out everywhere: every session of the signed-in user ends, this one included. */
export default defineEventHandler(async (event) => {
  const user = await requireSessionUser(event)
  await endSessionsOf(user.id)
  await clearUserSession(event)
  return { ok: true }
})
