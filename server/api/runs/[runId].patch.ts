import { eq } from 'drizzle-orm'
import { runRouteParamsSchema, runRenameSchema } from '#shared/types/runs'

/** Rename a run (editor or owner). */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run, user } = await requireRunAccess(event, runId, 'editor')
  const { name } = await readValidatedBody(event, runRenameSchema.parse)
  await useDb().update(tables.runs).set({ name }).where(eq(tables.runs.id, runId))
  await logActivity({ projectId: run.projectId, actorId: user.id, verb: 'renamed', objectType: 'run', objectId: runId,
    data: { from: run.name, to: name } })
  return await loadRunSummary(runId)
})
