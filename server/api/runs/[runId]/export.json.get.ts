import { runRouteParamsSchema } from '#shared/types/runs'
import { buildRunJson } from '#shared/runs/export'

/** The run as re-importable JSON (settings, points, special points, app version, caution) with its server-proven
 * certificates and the certified checklist of its pattern's hypotheses. */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run } = await requireRunAccess(event, runId, 'viewer')
  const [data, certificates] = await Promise.all([loadRunExport(runId, run.settings), loadCertificates(runId)])
  const existence = await runExistence(run, data.points.map(p => p.index), certificates)
  setResponseHeader(event, 'content-disposition', `attachment; filename="${exportFileName(runId, run.name, 'json')}"`)
  return { ...buildRunJson(data),
    certificates: { norm: 'max-norm of the unknowns', proven: certificates.certificates,
    segments: certificates.segments, existence } }
})
