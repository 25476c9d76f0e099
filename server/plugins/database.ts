/** Start opening, migrating and seeding the database as soon as the server boots. */
export default defineNitroPlugin(() => {
  ensureDatabase().catch((error) => {
    console.error('[wingfold] database start-up failed:', error)
  })
})
