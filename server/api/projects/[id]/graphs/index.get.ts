import { and, desc, eq } from 'drizzle-orm'
import { projectParamsSchema } from '#shared/types/projects'
import type { GraphListItem } from '#shared/types/api'

/** A project's gluing patterns with the analysis summary of their newest version. */
export default defineEventHandler(async (event): Promise<GraphListItem[]> => {
  const { id } = await getValidatedRouterParams(event, projectParamsSchema.parse)
  await requireProjectRole(event, id, 'viewer')
  const { graphs: g, graphVersions: v } = tables
  const rows = await useDb()
    .select({ id: g.id, name: g.name, description: g.description, version: g.latestVersion, summary: v.analysisSummary,
      updatedAt: g.updatedAt })
    .from(g).leftJoin(v, and(eq(v.graphId, g.id), eq(v.version, g.latestVersion)))
    .where(eq(g.projectId, id))
    .orderBy(desc(g.updatedAt), g.id)
  return rows.map(r => ({ ...r, summary: r.summary ? JSON.parse(r.summary) : null,
    updatedAt: r.updatedAt.toISOString() }))
})
