import { settingsUpdateSchema } from '#shared/types/admin'

/** Switch sign-up on or off (site administrators). */
export default defineEventHandler(async (event) => {
  await requireAdmin(event)
  const { signupEnabled } = await readValidatedBody(event, settingsUpdateSchema.parse)
  await setSignupEnabled(signupEnabled)
  return { signupEnabled }
})
