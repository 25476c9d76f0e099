import { runRouteParamsSchema } from '#shared/types/runs'
import { buildRunJson } from '../../../../app/utils/family/export'

/**
 * The run as re-importable JSON (settings, points, special points, app version, caution) with its
 * server-proven certificates.
 */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run } = await requireRunAccess(event, runId, 'viewer')
  const [data, certificates] = await Promise.all([loadRunExport(runId, run.settings), loadCertificates(runId)])
  setResponseHeader(event, 'content-disposition', `attachment; filename="${exportFileName(runId, run.name, 'json')}"`)
  return { ...buildRunJson(data),
    certificates: { norm: 'max-norm of the unknowns', proven: certificates.certificates,
    segments: certificates.segments } }
})
