import { eq } from 'drizzle-orm'
import { runRouteParamsSchema, type RunDetail } from '#shared/types/runs'

/** One run with its settings and the pattern document it was computed from. */
export default defineEventHandler(async (event): Promise<RunDetail> => {
  const { runId } = await getValidatedRouterParams(event, runRouteParamsSchema.parse)
  const { run, role } = await requireRunAccess(event, runId, 'viewer')
  const summary = await loadRunSummary(runId)
  const version = await useDb().query.graphVersions.findFirst({ where: eq(tables.graphVersions.id,
    run.graphVersionId) })
  return { ...summary!, settings: JSON.parse(run.settings), document: JSON.parse(version!.document), role }
})
