/** End this session: its row is deleted, so a replayed cookie no longer works. */
export default defineEventHandler(async (event) => {
  await endCurrentSession(event)
  return { ok: true }
})
