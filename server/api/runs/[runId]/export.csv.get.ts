import { runRouteParamsSchema } from '#shared/types/runs'
import { buildRunCsv } from '#shared/runs/export'

/** The run's points as CSV (header with units; app version, settings and caution as `#` lines). */
export default defineEventHandler(async (event) => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run } = await requireRunAccess(event, runId, 'viewer')
  const data = await loadRunExport(runId, run.settings)
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${exportFileName(runId, run.name, 'csv')}"`)
  return buildRunCsv(data)
})
