/** Site settings, for site administrators. */
export default defineEventHandler(async (event) => {
  await requireAdmin(event)
  return { signupEnabled: await isSignupEnabled() }
})
