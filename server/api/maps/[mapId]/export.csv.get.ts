import { mapToCsv } from '#shared/maps/export'
import { mapRouteParamsSchema } from '#shared/types/maps'

/** The map's cells as CSV, one line per cell (viewer or above). */
export default defineEventHandler(async (event) => {
  const { mapId } = await getValidatedRouterParams(event, mapRouteParamsSchema.parse)
  await requireMapAccess(event, mapId, 'viewer')
  const d = await loadMapDetail(mapId)
  setResponseHeader(event, 'content-type', 'text/csv; charset=utf-8')
  setResponseHeader(event, 'content-disposition', `attachment; filename="${mapExportName(mapId, d.name, 'csv')}"`)
  return `# wingfold map ${d.id} "${d.name}" of ${d.graphName} v${d.version}; settings ${JSON.stringify(d.settings)}; ${d.verification}: ${d.verificationReason ?? ''}\n# numerical evidence, not a proof\n${mapToCsv(d.result)}`
})
