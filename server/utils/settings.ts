/** Application settings stored in `app_settings`, with runtime-config defaults. */
import { eq } from 'drizzle-orm'

const SIGNUP_KEY = 'signup_enabled'

/** Whether sign-up is open: the admin's stored choice, else runtime config `allowSignup`. */
export async function isSignupEnabled(): Promise<boolean> {
  const row = await useDb().query.appSettings.findFirst({ where: eq(tables.appSettings.key, SIGNUP_KEY) })
  return row ? row.value === 'true' : !!useRuntimeConfig().allowSignup
}

/** Store the admin's sign-up choice. */
export async function setSignupEnabled(enabled: boolean): Promise<void> {
  const value = String(enabled)
  await useDb().insert(tables.appSettings).values({ key: SIGNUP_KEY, value })
    .onConflictDoUpdate({ target: tables.appSettings.key, set: { value } })
}
