import { graphParamsSchema, type GraphVersionItem } from '#shared/types/graphs'

/** The saved versions of a pattern, newest first (without documents). */
export default defineEventHandler(async (event): Promise<GraphVersionItem[]> => {
  const { id, graphId } = await getValidatedRouterParams(event, graphParamsSchema.parse)
  await requireProjectRole(event, id, 'viewer')
  return (await loadGraphDetail(id, graphId)).versions
})
