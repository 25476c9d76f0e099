import { eq } from 'drizzle-orm'
import { mapRouteParamsSchema } from '#shared/types/maps'

/** Delete a saved map (editor or owner). */
export default defineEventHandler(async (event) => {
  const { mapId } = await getValidatedRouterParams(event, mapRouteParamsSchema.parse)
  const { map, user } = await requireMapAccess(event, mapId, 'editor')
  await useDb().delete(tables.maps).where(eq(tables.maps.id, mapId))
  await logActivity({ projectId: map.projectId, actorId: user.id, verb: 'deleted', objectType: 'map', objectId: mapId,
    data: { name: map.name } })
  setResponseStatus(event, 204)
  return null
})
