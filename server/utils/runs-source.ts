/** The pattern version a run is computed from. */
import { and, eq } from 'drizzle-orm'

/** Version `version` (default: newest) of pattern `graphId` in project `projectId`; 404 otherwise. */
export async function resolveGraphVersion(projectId: number, graphId: number, version?: number) {
  const db = useDb()
  const graph = await db.query.graphs.findFirst({ where: and(eq(tables.graphs.id, graphId), eq(tables.graphs.projectId, projectId)) })
  if (!graph) throw httpError(404, 'graph_not_found', 'No such pattern in this project.')
  const row = await db.query.graphVersions.findFirst({ where: and(eq(tables.graphVersions.graphId, graphId), eq(tables.graphVersions.version, version ?? graph.latestVersion)) })
  if (!row) throw httpError(404, 'version_not_found', 'No such version of this pattern.')
  return { ...row, graphName: graph.name }
}
