/** The pattern version a run is computed from, and whether settings fit it. */
import { and, eq } from 'drizzle-orm'
import { familyProblem } from '#shared/families/build'
import type { FamilySettings } from '#shared/types/family'
import { parsePatternDocument } from '#shared/types/pattern'

/** Version `version` (default: newest) of pattern `graphId` in project `projectId`; 404 otherwise. */
export async function resolveGraphVersion(projectId: number, graphId: number, version?: number) {
  const db = useDb()
  const graph = await db.query.graphs.findFirst({ where: and(eq(tables.graphs.id, graphId),
    eq(tables.graphs.projectId, projectId)) })
  if (!graph) throw httpError(404, 'graph_not_found', 'No such pattern in this project.')
  const row = await db.query.graphVersions.findFirst({ where: and(eq(tables.graphVersions.graphId, graphId),
    eq(tables.graphVersions.version, version ?? graph.latestVersion)) })
  if (!row) throw httpError(404, 'version_not_found', 'No such version of this pattern.')
  return { ...row, graphName: graph.name }
}

/**
 * Refuses (400, nothing written) settings the pattern cannot run: a path for the other space,
 * unknown edge or wing ids, wing sets whose directions do not sum to zero — the same checks the
 * core makes when it builds the family (shared/families/build.ts).
 */
export function assertSettingsFit(documentText: string, settings: FamilySettings): void {
  try {
    familyProblem(parsePatternDocument(JSON.parse(documentText)), settings)
  } catch (e) {
    throw httpError(400, 'settings_do_not_fit',
      `These settings do not fit the pattern: ${(e as Error).message.replace(/^families: /, '')}.`)
  }
}
