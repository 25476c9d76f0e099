/** Hold every request until the database is migrated (and seeded on first start). */
export default defineEventHandler(async () => {
  await ensureDatabase()
})
