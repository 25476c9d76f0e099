/**
 * Census rows in SQLite: one row per pattern class (unique canonical code; a second job that
 * meets the same class leaves the first row alone), job counters, and the views the API returns.
 */
import { eq } from 'drizzle-orm'
import type { CensusProgress, CensusRow } from '#shared/census/run'
import type { CensusJobView, CensusPatternView } from '#shared/types/census'

type JobRow = typeof tables.censusJobs.$inferSelect
type PatternRow = typeof tables.censusPatterns.$inferSelect

/** Stores one classified pattern (ignored when its code is already stored). */
export async function storeCensusRow(jobId: number, r: CensusRow): Promise<void> {
  await useDb().insert(tables.censusPatterns).values({
    code: r.code, mirrorCode: r.mirrorCode, chiral: r.chiral, towers: r.towers, edges: r.edges,
    halfEdges: r.halfEdges, faces: r.faces, degrees: r.degrees.join(','), faceSizes: r.faceSizes.join(','),
    predictedGenus: r.predictedGenus, automorphisms: r.automorphisms, balanced: r.balanced, reason: r.reason,
    rigid: r.rigid, phaseKernelDimension: r.phaseKernelDimension, tau: JSON.stringify(r.tau),
    failing: JSON.stringify(r.failing), document: JSON.stringify(r.document), jobId,
  }).onConflictDoNothing({ target: tables.censusPatterns.code })
}

/** Every stored code (the resume skip list). */
export async function storedCensusCodes(): Promise<Set<string>> {
  const rows = await useDb().select({ code: tables.censusPatterns.code }).from(tables.censusPatterns)
  return new Set(rows.map(r => r.code))
}

/** Writes a job's counters (and optionally its status). */
export async function updateCensusJob(jobId: number,
  p: Partial<CensusProgress> & { status?: JobRow['status'], error?: string | null,
  finished?: boolean }): Promise<void> {
  await useDb().update(tables.censusJobs).set({
    ...(p.visited !== undefined ? { visited: p.visited } : {}),
    ...(p.found !== undefined ? { found: p.found } : {}),
    ...(p.classified !== undefined ? { classified: p.classified } : {}),
    ...(p.status ? { status: p.status } : {}),
    ...(p.error !== undefined ? { error: p.error } : {}),
    ...(p.finished ? { finishedAt: new Date() } : {}),
  }).where(eq(tables.censusJobs.id, jobId))
}

export function censusJobView(j: JobRow): CensusJobView {
  return {
    id: j.id, status: j.status, queue: j.queue, maxTowers: j.maxTowers, maxHalfEdges: j.maxHalfEdges,
    visited: j.visited, found: j.found, classified: j.classified, error: j.error,
    createdAt: j.createdAt.toISOString(), finishedAt: j.finishedAt ? j.finishedAt.toISOString() : null,
  }
}

export function censusPatternView(p: PatternRow): CensusPatternView {
  return {
    id: p.id, code: p.code, mirrorCode: p.mirrorCode, chiral: p.chiral, towers: p.towers, edges: p.edges,
    halfEdges: p.halfEdges, faces: p.faces, degrees: p.degrees.split(',').map(Number), faceSizes: p.faceSizes.split(',').map(Number),
    predictedGenus: p.predictedGenus, automorphisms: p.automorphisms, balanced: p.balanced, reason: p.reason,
    rigid: p.rigid, phaseKernelDimension: p.phaseKernelDimension, tau: JSON.parse(p.tau) as [number, number],
  }
}
