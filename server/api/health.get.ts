/** Liveness and readiness: answers once the database is migrated. */
export default defineEventHandler(() => ({ ok: true, version: useRuntimeConfig().public.appVersion }))
