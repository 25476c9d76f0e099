import { eq } from 'drizzle-orm'
import { VERTICAL_BALANCE_DEFINITION } from '#shared/pattern/report'
import { mapRouteParamsSchema, type MapResult, type MapSettings } from '#shared/types/maps'
import { parsePatternDocument } from '#shared/types/pattern'

/**
 * Re-verify a saved map's sampled cells under the current definition of vertical balance
 * (editor or owner); the verdict and the definition it used replace the stored ones.
 */
export default defineEventHandler(async (event) => {
  const { mapId } = await getValidatedRouterParams(event, mapRouteParamsSchema.parse)
  const { map, user } = await requireMapAccess(event, mapId, 'editor')
  const version = await useDb().query.graphVersions.findFirst({ where: eq(tables.graphVersions.id,
    map.graphVersionId) })
  if (!version) throw httpError(500, 'version_missing', 'The pattern version of this map is missing.')
  const { result } = JSON.parse(map.result) as { result: MapResult }
  const check = checkPostedMap(parsePatternDocument(JSON.parse(version.document)),
    JSON.parse(map.settings) as MapSettings, result)
  await useDb().update(tables.maps).set({ verification: check.verification, verificationReason: check.reason,
    verticalBalance: VERTICAL_BALANCE_DEFINITION }).where(eq(tables.maps.id, mapId))
  await logActivity({ projectId: map.projectId, actorId: user.id, verb: 're-verified', objectType: 'map',
    objectId: mapId })
  return loadMapDetail(mapId)
})
