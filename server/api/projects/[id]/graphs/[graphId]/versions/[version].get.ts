import { graphVersionParamsSchema, type GraphDetail } from '#shared/types/graphs'

/** One saved version of a pattern, with its document. */
export default defineEventHandler(async (event): Promise<GraphDetail> => {
  const { id, graphId, version } = await getValidatedRouterParams(event, graphVersionParamsSchema.parse)
  await requireProjectRole(event, id, 'viewer')
  return loadGraphDetail(id, graphId, version)
})
