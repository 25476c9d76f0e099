/** Public sign-up switch, so the sign-up page can say when it is closed. */
export default defineEventHandler(async () => ({ signupEnabled: await isSignupEnabled() }))
