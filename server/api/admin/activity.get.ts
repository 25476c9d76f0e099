import { activityQuerySchema } from '#shared/types/team'

/** Every project's activity, paginated and filtered (site admins; `projectId` narrows). */
export default defineEventHandler(async (event) => {
  await requireAdmin(event)
  const query = await getValidatedQuery(event, activityQuerySchema.parse)
  const [page, facets] = await Promise.all([activityPage(query), activityFacets(query.projectId)])
  return { ...page, facets }
})
