/**
 * Appending a batch of points to a run: every point is re-evaluated with the run's document and
 * settings before anything is stored; one offending point rejects the run (reason naming the
 * point) and nothing of the batch is written.
 *
 * Crash safety: the points and the run's counts are written in one batch (one transaction), so a killed
 * server leaves either both or neither. Idempotency: a batch whose every point is already stored
 * with the same λ (a retry after a lost answer) is answered 200 with the current counts and
 * `duplicate: true`, and nothing is written again; a batch that overlaps stored points only in
 * part, or with other values, is a 409.
 */
import { and, eq, inArray, sql } from 'drizzle-orm'
import type { z } from 'zod'
import type { runBatchSchema } from '#shared/types/runs'
import { checkPoints, countRunPoints, loadRunProblem, rejectRun, rejectionReason } from './runs-verify'
import { specialRowIndex } from './runs'

type Batch = z.infer<typeof runBatchSchema>
type RunRow = typeof tables.runs.$inferSelect

/** Result of an append: stored counts, or the offending points. */
export interface AppendResult {
  accepted: boolean
  pointCount: number
  specialCount: number
  offending: Array<{ name: string, index: number, residualNorm: number | null, reason: string }>
  reason?: string
  /** The batch had been stored before (a retry): nothing was written this time. */
  duplicate?: boolean
}

/** Row indices (special point k → −1 − k) and λ of a batch. */
function batchKeys(batch: Batch): Map<number, number> {
  return new Map([...batch.points.map(p => [p.index, p.lambda] as const),
    ...batch.specialPoints.map(p => [specialRowIndex(p.index), p.lambda] as const)])
}

/** 'all' when every point of the batch is stored with the same λ, 'none' when none is, else 'some'. */
async function storedPart(runId: number, keys: Map<number, number>): Promise<'all' | 'none' | 'some'> {
  if (!keys.size) return 'none'
  const rp = tables.runPoints
  const rows = await useDb().select({ index: rp.index, lambda: rp.lambda }).from(rp).where(and(eq(rp.runId, runId),
    inArray(rp.index, [...keys.keys()])))
  if (!rows.length) return 'none'
  return rows.length === keys.size && rows.every(r => r.lambda === keys.get(r.index)) ? 'all' : 'some'
}

/** Checks and stores one batch (see file header). Throws 409 when the run no longer takes points. */
export async function appendBatch(run: RunRow, batch: Batch): Promise<AppendResult> {
  const keys = batchKeys(batch)
  const stored = await storedPart(run.id, keys)
  if (stored === 'all') {
    const counts = await countRunPoints(run.id)
    return { accepted: true, pointCount: counts.points, specialCount: counts.special, offending: [], duplicate: true }
  }
  if (stored === 'some') throw httpError(409, 'point_exists', 'A point with one of these indices is already saved.')
  if (run.verification === 'rejected') throw httpError(409, 'run_rejected',
    `This run was rejected and takes no more points: ${run.verificationReason ?? ''}`)
  if (run.status !== 'running') throw httpError(409, 'run_finished',
    `This run is ${run.status} and takes no more points.`)
  const { doc, settings } = await loadRunProblem(run)
  const check = checkPoints(doc, settings, batch.points, batch.specialPoints)
  if (!check.ok) {
    const reason = rejectionReason(check)
    await rejectRun(run.id, reason)
    const counts = await countRunPoints(run.id)
    const offending = check.offending.map(o => ({ name: o.name, index: o.index,
      residualNorm: Number.isFinite(o.residualNorm) ? o.residualNorm : null, reason: o.reason }))
    return { accepted: false, pointCount: counts.points, specialCount: counts.special, offending, reason }
  }
  const rows = [
    ...batch.points.map(({ index, lambda, diagnostics, ...rest }) => ({
      runId: run.id, index, lambda, residual: check.residuals.points.get(index)!,
      state: JSON.stringify(rest), diagnostics: JSON.stringify({ ...diagnostics,
        ...(rest.sigmaMin !== undefined ? { sigmaMin: rest.sigmaMin } : {}) }), specialKind: null,
    })),
    ...batch.specialPoints.map(({ index, lambda, kind, ...rest }) => ({
      runId: run.id, index: specialRowIndex(index), lambda, residual: check.residuals.special.get(index)!,
      state: JSON.stringify(rest), diagnostics: '{}', specialKind: kind,
    })),
  ]
  const rp = tables.runPoints
  const db = useDb()
  let counts: { points: number, special: number }
  try {
    // One batch = one transaction, run without yielding: the points and the counts are stored
    // together or not at all (a killed server leaves neither half).
    const inserts = []
    for (let i = 0; i < rows.length; i += 100) inserts.push(db.insert(rp).values(rows.slice(i, i + 100)))
    const update = db.update(tables.runs).set({
      pointCount: sql`(SELECT count(*) FROM run_points WHERE run_id = ${run.id} AND "index" >= 0)`,
      specialCount: sql`(SELECT count(*) FROM run_points WHERE run_id = ${run.id} AND "index" < 0)`,
    }).where(eq(tables.runs.id, run.id)).returning({ points: tables.runs.pointCount, special: tables.runs.specialCount })
    const results = await db.batch([...inserts, update] as unknown as [typeof update])
    counts = (results.at(-1) as Array<{ points: number, special: number }>)[0]!
  } catch (e) {
    if (/UNIQUE/i.test(String((e as { cause?: unknown }).cause ?? e))) throw httpError(409, 'point_exists',
      'A point with one of these indices is already saved.')
    throw e
  }
  return { accepted: true, pointCount: counts.points, specialCount: counts.special, offending: [] }
}
