import { eq } from 'drizzle-orm'
import { runFinishSchema, runRouteParamsSchema } from '#shared/types/runs'

/** Mark a running run complete, stopped (no convergence), cancelled or failed, store why, then re-check its stored
 * points. */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run, user } = await requireRunAccess(event, runId, 'editor')
  const { status, reason } = await readValidatedBody(event, runFinishSchema.parse)
  if (run.status !== 'running') throw httpError(409, 'run_finished', `This run is already ${run.status}.`)
  await useDb().update(tables.runs).set({ status, finishReason: reason || null }).where(eq(tables.runs.id, runId))
  await verifyStoredRun(runId)
  await logActivity({ projectId: run.projectId, actorId: user.id, verb: 'finished', objectType: 'run', objectId: runId,
    data: { status, ...(reason ? { reason: reason.slice(0, 120) } : {}) } })
  return await loadRunSummary(runId)
})
