import { z } from 'zod'
import { graphParamsSchema, type GraphDetail } from '#shared/types/graphs'

const query = z.object({ version: z.coerce.number().int().positive().optional() })

/** A pattern with the newest (or `?version=`) document and the list of its versions. */
export default defineEventHandler(async (event): Promise<GraphDetail> => {
  const { id, graphId } = await getValidatedRouterParams(event, graphParamsSchema.parse)
  const { version } = await getValidatedQuery(event, query.parse)
  await requireProjectRole(event, id, 'viewer')
  return loadGraphDetail(id, graphId, version)
})
