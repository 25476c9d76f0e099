import { mapRouteParamsSchema } from '#shared/types/maps'

/** The whole map as JSON: settings, cells with states, crossings, curves, verification (viewer or above). */
export default defineEventHandler(async (event) => {
  const { mapId } = await getValidatedRouterParams(event, mapRouteParamsSchema.parse)
  await requireMapAccess(event, mapId, 'viewer')
  const d = await loadMapDetail(mapId)
  setResponseHeader(event, 'content-disposition', `attachment; filename="${mapExportName(mapId, d.name, 'json')}"`)
  return { format: 'wingfold-map', formatVersion: 1, caution: 'numerical evidence, not a proof', ...d }
})
