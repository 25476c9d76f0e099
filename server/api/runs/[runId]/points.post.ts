import { runBatchSchema, runRouteParamsSchema } from '#shared/types/runs'

/**
 * Append a batch of points; 422 naming the offending points when one fails the residual check (the
 * run is then rejected).
 */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run } = await requireRunAccess(event, runId, 'editor')
  const batch = await readValidatedBody(event, runBatchSchema.parse)
  const result = await appendBatch(run, batch)
  if (!result.accepted) throw createError({ statusCode: 422, message: result.reason,
    data: { code: 'residual_check_failed', offending: result.offending } })
  return result
})
