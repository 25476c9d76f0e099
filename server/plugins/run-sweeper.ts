/** Every `runSweepSeconds` (default 60), end runs nobody writes to any more (server/utils/runs-idle.ts). */
export default defineNitroPlugin(() => {
  const every = Math.max(0.2, Number(useRuntimeConfig().runSweepSeconds)) * 1000
  const timer = setInterval(() => {
    ensureDatabase().then(() => endIdleRuns()).catch(error => console.error('[wingfold] idle runs:', error))
  }, every)
  timer.unref()
})
