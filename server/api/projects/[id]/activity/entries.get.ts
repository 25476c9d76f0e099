import { projectParamsSchema } from '#shared/types/projects'
import { activityQuerySchema } from '#shared/types/team'

/** The project's activity log, paginated and filtered (any member). Includes filter choices. */
export default defineEventHandler(async (event) => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  await requireProjectRole(event, id, 'viewer')
  const query = await getValidatedQuery(event, activityQuerySchema.parse)
  const [page, facets] = await Promise.all([activityPage({ ...query, projectId: id }), activityFacets(id)])
  return { ...page, facets }
})
