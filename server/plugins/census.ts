/** Census at start-up: in-process jobs cut off by a restart become 'interrupted' (resumable). */
export default defineNitroPlugin(async () => {
  try {
    await ensureDatabase()
    await markInterruptedCensusJobs()
  } catch (error) {
    console.error('[wingfold] census start-up failed:', error)
  }
})
