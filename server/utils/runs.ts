/**
 * Runs on the server: row mapping and how points are stored (access: requireRunAccess in access.ts).
 *
 * Storage rule: regular points are rows of `run_points` with `index` ≥ 0 (their position in the
 * branch) and `special_kind` null; special point k is a row with `index` = −1 − k and
 * `special_kind` set to its plain-word kind. `state` holds the rest of the engine's point as JSON
 * (u, tangent, step sizes, tests / kernel, label, precision, …); `residual` is the max|F| the
 * server recomputed when the point was saved, never the value the browser claimed.
 */
import { and, eq, gte, lt } from 'drizzle-orm'
import type { RunSummary, StoredRunPoint } from '#shared/types/runs'

/** Row index of special point k. */
export const specialRowIndex = (k: number): number => -1 - k
/** Special point number of a row index < 0. */
export const specialNumber = (rowIndex: number): number => -1 - rowIndex

/** Columns of a run summary (joined with its pattern, version, author and project). */
export function runSummarySelect() {
  const { runs: r, graphs: g, graphVersions: v, users: u, projects: p } = tables
  return {
    run: r, graphId: g.id, graphName: g.name, graphVersion: v.version, authorName: u.name, projectName: p.name,
  }
}

/** The FROM … JOIN part matching {@link runSummarySelect}. */
export function runSummaryQuery() {
  const { runs: r, graphs: g, graphVersions: v, users: u, projects: p } = tables
  return useDb().select(runSummarySelect()).from(r)
    .innerJoin(v, eq(v.id, r.graphVersionId))
    .innerJoin(g, eq(g.id, v.graphId))
    .innerJoin(p, eq(p.id, r.projectId))
    .leftJoin(u, eq(u.id, r.authorId))
}

type SummaryRow = Awaited<ReturnType<ReturnType<typeof runSummaryQuery>['all']>>[number]

/** A joined row as the API shape. */
export function toRunSummary(row: SummaryRow): RunSummary {
  const r = row.run
  return {
    id: r.id, projectId: r.projectId, projectName: row.projectName, graphId: row.graphId, graphName: row.graphName, graphVersion: row.graphVersion,
    name: r.name, pathKind: r.pathKind, status: r.status, verification: r.verification, verificationReason: r.verificationReason, verticalBalance: r.verticalBalance, finishReason: r.finishReason ?? null,
    pointCount: r.pointCount, specialCount: r.specialCount, authorId: r.authorId, authorName: row.authorName ?? null,
    parentRunId: r.parentRunId, restartPointIndex: r.restartPointIndex, appVersion: r.appVersion,
    createdAt: r.createdAt.toISOString(), updatedAt: r.updatedAt.toISOString(),
  }
}

/** One run's summary, or undefined. */
export async function loadRunSummary(runId: number): Promise<RunSummary | undefined> {
  const row = await runSummaryQuery().where(eq(tables.runs.id, runId)).get()
  return row ? toRunSummary(row) : undefined
}

type PointRow = typeof tables.runPoints.$inferSelect

/** A stored row as the API shape. */
export function toStoredPoint(row: PointRow): StoredRunPoint {
  return {
    index: row.index < 0 ? specialNumber(row.index) : row.index,
    lambda: row.lambda, residual: row.residual, specialKind: row.specialKind,
    state: JSON.parse(row.state), diagnostics: JSON.parse(row.diagnostics),
  }
}

/** Regular points of a run, by index, from `offset` (at most `limit`). */
export async function loadRunPoints(runId: number, offset = 0, limit = 1_000_000): Promise<StoredRunPoint[]> {
  const rp = tables.runPoints
  const rows = await useDb().select().from(rp)
    .where(and(eq(rp.runId, runId), gte(rp.index, offset), lt(rp.index, offset + limit)))
    .orderBy(rp.index)
  return rows.map(toStoredPoint)
}

/** Special points of a run, in order. */
export async function loadSpecialPoints(runId: number): Promise<StoredRunPoint[]> {
  const rp = tables.runPoints
  const rows = await useDb().select().from(rp).where(and(eq(rp.runId, runId), lt(rp.index, 0)))
  return rows.map(toStoredPoint).sort((a, b) => a.index - b.index)
}
