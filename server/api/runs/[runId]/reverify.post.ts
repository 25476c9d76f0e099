import { runRouteParamsSchema } from '#shared/types/runs'

/**
 * Re-verify a run from its stored points under the current definition of vertical balance
 * (editor or owner). The new verdict replaces the old one, also a rejection, and records the
 * definition it used.
 */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run, user } = await requireRunAccess(event, runId, 'editor')
  if (run.status === 'running') throw httpError(409, 'run_running', 'Finish the run before re-verifying it.')
  await verifyStoredRun(runId, true)
  await logActivity({ projectId: run.projectId, actorId: user.id, verb: 're-verified', objectType: 'run',
    objectId: runId })
  return await loadRunSummary(runId)
})
