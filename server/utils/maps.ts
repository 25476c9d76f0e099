/**
 * Saved maps on the server (access: requireMapAccess in access.ts): summaries, and the check of a
 * posted map. The server re-derives the grid from the settings, then recomputes max|F| with the
 * same core (shared/maps/verify.ts) at a seeded sample of solved cells; a map with any offending
 * cell, or a grid that does not match its settings, is stored as "rejected" with the reason; a
 * map without any solved cell stays "pending" (nothing could be verified).
 */
import { formatNumber } from '#shared/format'
import { desc, eq } from 'drizzle-orm'
import { sampleCells, verifyMapCells } from '#shared/maps/verify'
import { axisValues, type MapCurve, type MapDetail, type MapResult, type MapSettings,
  type MapSummary } from '#shared/types/maps'
import type { PatternDocument } from '#shared/types/pattern'

/** Solved cells the server re-evaluates per map. */
export const MAP_VERIFY_SAMPLE = 40
/** Largest max|F| a stored cell may have (the grid value is met to the engine's locate tolerance). */
export const MAP_RESIDUAL_TOLERANCE = 1e-7

/** Verification verdict of a posted map against its document and settings. */
export function checkPostedMap(doc: PatternDocument, settings: MapSettings,
  result: MapResult): { verification: 'verified' | 'rejected' | 'pending'; reason: string } {
  const xs = axisValues(settings.x), ys = axisValues(settings.y)
  const close = (a: number[],
    b: number[]) => a.length === b.length && a.every((v, k) => Math.abs(v - b[k]!) <= 1e-12 * (1 + Math.abs(v)))
  if (!close(xs, result.xs) || !close(ys, result.ys)) return { verification: 'rejected',
    reason: 'the grid does not match the settings' }
  const cells = result.rows.flatMap(r => r.cells)
  const bad = cells.find(c => c.x !== result.xs[c.j] || c.y !== result.ys[c.i])
  if (bad) return { verification: 'rejected', reason: `cell (${bad.i}, ${bad.j}) is not at its grid point` }
  const v = verifyMapCells(doc, settings, sampleCells(cells, MAP_VERIFY_SAMPLE), MAP_RESIDUAL_TOLERANCE)
  // Nothing re-evaluated is nothing verified: such a map stays unverified ("pending"), saying why.
  if (v.checked === 0) return { verification: 'pending',
    reason: 'not verified: the map has no solved cell, so there is nothing to re-evaluate' }
  if (!v.verified) return { verification: 'rejected',
    reason: `${v.offending.length} of ${v.checked} sampled cells fail: ${v.offending.slice(0, 3).map(o => `(${o.i}, ${o.j}) ${o.reason}`).join('; ')}` }
  return { verification: 'verified',
    reason: `${v.checked} sampled cells re-evaluated, max|F| = ${formatNumber(v.maxResidual)}` }
}

function summarySelect() {
  const { maps: m, graphs: g, graphVersions: v, users: u } = tables
  return useDb().select({ map: m, graphId: g.id, graphName: g.name, version: v.version, authorName: u.name })
    .from(m).innerJoin(v, eq(v.id, m.graphVersionId)).innerJoin(g, eq(g.id, v.graphId)).leftJoin(u,
      eq(u.id, m.authorId))
}
type SummaryRow = Awaited<ReturnType<typeof summarySelect>>[number]

function toSummary(r: SummaryRow): MapSummary {
  const m = r.map
  return {
    id: m.id, projectId: m.projectId, name: m.name, plane: m.plane as MapSummary['plane'], graphId: r.graphId, graphName: r.graphName,
    version: r.version, cellCount: m.cellCount, solvedCount: m.solvedCount, wallMs: m.wallMs, workers: m.workers,
    verification: m.verification, verificationReason: m.verificationReason, verticalBalance: m.verticalBalance, authorName: r.authorName, createdAt: m.createdAt.toISOString(),
  }
}

/** The project's maps, newest first. */
export async function listMaps(projectId: number): Promise<MapSummary[]> {
  return (await summarySelect().where(eq(tables.maps.projectId,
    projectId)).orderBy(desc(tables.maps.id))).map(toSummary)
}

/** One map with its cells, curves and the pattern document it was computed from. */
export async function loadMapDetail(mapId: number): Promise<MapDetail> {
  const [row] = await summarySelect().where(eq(tables.maps.id, mapId))
  if (!row) throw httpError(404, 'map_not_found', 'No such map.')
  const version = await useDb().query.graphVersions.findFirst({ where: eq(tables.graphVersions.id,
    row.map.graphVersionId) })
  const stored = JSON.parse(row.map.result) as { result: MapResult; curves: MapCurve[] }
  return { ...toSummary(row), settings: JSON.parse(row.map.settings) as MapSettings, result: stored.result,
    curves: stored.curves, document: JSON.parse(version!.document) as unknown }
}

/** A file name for exports. */
export function mapExportName(id: number, name: string, ext: string): string {
  return `map-${id}-${name.replace(/[^\w.-]+/g, '-').slice(0, 60)}.${ext}`
}
