import { runRouteParamsSchema, runPointsQuerySchema } from '#shared/types/runs'

/** A page of a run's regular points, by index. */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run } = await requireRunAccess(event, runId, 'viewer')
  const { offset, limit } = await getValidatedQuery(event, runPointsQuerySchema.parse)
  return { total: run.pointCount, offset, points: await loadRunPoints(runId, offset, limit) }
})
