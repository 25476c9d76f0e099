import { projectParamsSchema } from '#shared/types/projects'
import type { MapSummary } from '#shared/types/maps'

/** The project's saved maps (viewer or above), newest first. */
export default defineEventHandler(async (event): Promise<MapSummary[]> => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  await requireProjectRole(event, id, 'viewer')
  return listMaps(id)
})
