import { eq } from 'drizzle-orm'
import { runRouteParamsSchema } from '#shared/types/runs'

/** Delete a run and its points (editor or owner). */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run, user } = await requireRunAccess(event, runId, 'editor')
  await useDb().delete(tables.runs).where(eq(tables.runs.id, runId))
  await logActivity({ projectId: run.projectId, actorId: user.id, verb: 'deleted', objectType: 'run', objectId: runId,
    data: { name: run.name } })
  setResponseStatus(event, 204)
  return null
})
