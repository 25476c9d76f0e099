import { and, asc, desc, eq, gte, lt, type SQL } from 'drizzle-orm'
import { projectParamsSchema } from '#shared/types/projects'
import { runListQuerySchema, type RunSummary } from '#shared/types/runs'

/** A project's runs, filtered by pattern, kind, status, verification, author and date, sorted. */
export default defineEventHandler(async (event): Promise<RunSummary[]> => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  await requireProjectRole(event, id, 'viewer')
  const q = await getValidatedQuery(event, runListQuerySchema.parse)
  const { runs: r, graphs: g } = tables
  const where: SQL[] = [eq(r.projectId, id)]
  if (q.graphId) where.push(eq(g.id, q.graphId))
  if (q.kind) where.push(eq(r.pathKind, q.kind))
  if (q.status) where.push(eq(r.status, q.status))
  if (q.verification) where.push(eq(r.verification, q.verification))
  if (q.authorId) where.push(eq(r.authorId, q.authorId))
  if (q.from) where.push(gte(r.createdAt, new Date(`${q.from}T00:00:00Z`)))
  if (q.to) where.push(lt(r.createdAt, new Date(new Date(`${q.to}T00:00:00Z`).getTime() + 86_400_000)))
  const dir = q.order === 'asc' ? asc : desc
  const rows = await runSummaryQuery().where(and(...where)).orderBy(dir(r[q.sort]), dir(r.id))
  return rows.map(toRunSummary)
})
