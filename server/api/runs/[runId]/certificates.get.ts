import { runRouteParamsSchema } from '#shared/types/runs'

/** The server-proven certificates of a run's points. */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  await requireRunAccess(event, runId, 'viewer')
  return { certificates: await loadCertificates(runId) }
})
