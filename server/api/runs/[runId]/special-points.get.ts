import { runRouteParamsSchema } from '#shared/types/runs'

/** A run's special points, in the order they were found. */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  await requireRunAccess(event, runId, 'viewer')
  return await loadSpecialPoints(runId)
})
