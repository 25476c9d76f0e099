/**
 * Writing pattern versions: body size guard, the core's cross-checks, the stored analysis
 * summary and the activity entry, shared by the create, save and restore routes.
 */
import type { H3Event } from 'h3'
import { and, desc, eq, sql } from 'drizzle-orm'
import { safeParsePatternDocument, type PatternDocument } from '#shared/types/pattern'
import { MAX_PATTERN_BYTES, type GraphDetail, type GraphVersionItem } from '#shared/types/graphs'
import { analyzePattern } from '#shared/pattern/analyze'

/** 413 before reading a body whose declared length exceeds the pattern limit. */
export function assertBodySize(event: H3Event): void {
  const length = Number(getRequestHeader(event, 'content-length') ?? 0)
  if (length > MAX_PATTERN_BYTES) {
    throw httpError(413, 'pattern_too_large',
      `Pattern documents are limited to ${(MAX_PATTERN_BYTES / 1e6).toFixed(1)} MB; this upload is ${(length / 1e6).toFixed(1)} MB.`)
  }
}

/** The core's cross-reference checks; 422 listing each problem with its JSON path. */
export function checkedDocument(doc: unknown): PatternDocument {
  const parsed = safeParsePatternDocument(doc)
  if (!parsed.success) {
    throw createError({
      statusCode: 422,
      message: parsed.issues.map(i => (i.path ? `${i.path}: ${i.message}` : i.message)).join('\n'),
      data: { code: 'invalid_pattern', issues: parsed.issues },
    })
  }
  return parsed.data
}

/** The analysis summary as stored JSON, or null when the analysis itself throws. */
function summaryOf(doc: PatternDocument): string | null {
  try { return JSON.stringify(analyzePattern(doc).summary) }
  catch { return null }
}

/**
 * Create a pattern in a project with its first version: the graph row, version 1 and the project's
 * `updatedAt` in one batch (a failure leaves no graph without a version), then the activity entry.
 */
export async function createGraph(args: {
  projectId: number, authorId: number, name: string, description: string, document: PatternDocument, message: string,
}): Promise<{ id: number, version: number }> {
  const db = useDb()
  // last_insert_rowid(): the graph inserted just before, on the batch's one connection
  const graphId = sql<number>`last_insert_rowid()` as unknown as number
  const [[g]] = await db.batch([
    db.insert(tables.graphs).values({
      projectId: args.projectId, name: args.name, description: args.description, createdBy: args.authorId, latestVersion: 1,
    }).returning({ id: tables.graphs.id }),
    db.insert(tables.graphVersions).values({
      graphId, version: 1, document: JSON.stringify(args.document), message: args.message,
      analysisSummary: summaryOf(args.document), authorId: args.authorId,
    }),
    db.update(tables.projects).set({ updatedAt: new Date() }).where(eq(tables.projects.id, args.projectId)),
  ])
  const id = g!.id
  await logActivity({ projectId: args.projectId, actorId: args.authorId, verb: 'created', objectType: 'graph',
    objectId: id, data: { name: args.name, version: 1 } })
  return { id, version: 1 }
}

/** Append version `latest + 1` of graph `graphId` and log it; returns the new version number. */
export async function appendVersion(args: {
  projectId: number, graphId: number, authorId: number, document: PatternDocument, message: string, verb: string,
}): Promise<number> {
  const db = useDb()
  const g = await db.query.graphs.findFirst({ where: and(eq(tables.graphs.id, args.graphId),
    eq(tables.graphs.projectId, args.projectId)) })
  if (!g) throw httpError(404, 'graph_not_found', 'No such pattern in this project.')
  // The number is taken inside the batch (which runs without yielding): two saves at once get
  // n + 1 and n + 2 instead of both reading n and one failing on the unique version.
  const next = sql<number>`(SELECT latest_version + 1 FROM graphs WHERE id = ${g.id})` as unknown as number
  const [, [row]] = await db.batch([
    db.insert(tables.graphVersions).values({
      graphId: g.id, version: next, document: JSON.stringify(args.document), message: args.message,
      analysisSummary: summaryOf(args.document), authorId: args.authorId,
    }),
    db.update(tables.graphs).set({ latestVersion: sql`latest_version + 1`,
      updatedAt: new Date() }).where(eq(tables.graphs.id, g.id)).returning({ version: tables.graphs.latestVersion }),
  ])
  const version = row!.version
  await logActivity({ projectId: args.projectId, actorId: args.authorId, verb: args.verb, objectType: 'graph',
    objectId: g.id, data: { name: g.name, version } })
  return version
}

/** A graph of a project with one version's document (the newest when `version` is absent). */
export async function loadGraphDetail(projectId: number, graphId: number, version?: number): Promise<GraphDetail> {
  const db = useDb()
  const g = await db.query.graphs.findFirst({ where: and(eq(tables.graphs.id, graphId),
    eq(tables.graphs.projectId, projectId)) })
  if (!g) throw httpError(404, 'graph_not_found', 'No such pattern in this project.')
  const v = tables.graphVersions
  const rows = await db.select({ version: v.version, message: v.message, authorName: tables.users.name,
    summary: v.analysisSummary, createdAt: v.createdAt })
    .from(v).leftJoin(tables.users, eq(tables.users.id, v.authorId))
    .where(eq(v.graphId, g.id)).orderBy(desc(v.version))
  const wanted = version ?? g.latestVersion
  const row = await db.query.graphVersions.findFirst({ where: and(eq(v.graphId, g.id), eq(v.version, wanted)) })
  if (!row) throw httpError(404, 'version_not_found', `Pattern ${g.name} has no version ${wanted}.`)
  const versions: GraphVersionItem[] = rows.map(r => ({ ...r, summary: r.summary ? JSON.parse(r.summary) : null,
    createdAt: r.createdAt.toISOString() }))
  return {
    id: g.id, projectId, name: g.name, description: g.description, latestVersion: g.latestVersion,
    version: row.version, document: JSON.parse(row.document), summary: row.analysisSummary ? JSON.parse(row.analysisSummary) : null, versions,
  }
}
