import { mapRouteParamsSchema, type MapDetail } from '#shared/types/maps'

/** One saved map with its cells, curves and pattern document (viewer or above). */
export default defineEventHandler(async (event): Promise<MapDetail> => {
  const { mapId } = await getValidatedRouterParams(event, mapRouteParamsSchema.parse)
  await requireMapAccess(event, mapId, 'viewer')
  return loadMapDetail(mapId)
})
