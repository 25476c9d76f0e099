import { z } from 'zod'
import { projectParamsSchema } from '#shared/types/projects'
import type { RunSource } from '#shared/types/runs'

const querySchema = z.object({ graphId: z.coerce.number().int().positive(),
  version: z.coerce.number().int().positive().optional() })

/** The pattern document and analysis summary a new run starts from (for the setup form). */
export default defineEventHandler(async (event): Promise<RunSource> => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  await requireProjectRole(event, id, 'viewer')
  const q = await getValidatedQuery(event, querySchema.parse)
  const v = await resolveGraphVersion(id, q.graphId, q.version)
  return { graphId: q.graphId, graphName: v.graphName, version: v.version, document: JSON.parse(v.document),
    summary: v.analysisSummary ? JSON.parse(v.analysisSummary) : null }
})
