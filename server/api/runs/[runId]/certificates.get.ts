import { runRouteParamsSchema } from '#shared/types/runs'

/** The server-proven certificates of a run's points and segments. */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  await requireRunAccess(event, runId, 'viewer')
  return loadCertificates(runId)
})
