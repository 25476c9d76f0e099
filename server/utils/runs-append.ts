/**
 * Appending a batch of points to a run: every point is re-evaluated with the run's document and
 * settings before anything is stored; one offending point rejects the run (reason naming the
 * point) and nothing of the batch is written.
 */
import { eq } from 'drizzle-orm'
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
}

/** Checks and stores one batch (see file header). Throws 409 when the run no longer takes points. */
export async function appendBatch(run: RunRow, batch: Batch): Promise<AppendResult> {
  if (run.verification === 'rejected') throw httpError(409, 'run_rejected', `This run was rejected and takes no more points: ${run.verificationReason ?? ''}`)
  if (run.status !== 'running') throw httpError(409, 'run_finished', `This run is ${run.status} and takes no more points.`)
  const { doc, settings } = await loadRunProblem(run)
  const check = checkPoints(doc, settings, batch.points, batch.specialPoints)
  if (!check.ok) {
    const reason = rejectionReason(check)
    await rejectRun(run.id, reason)
    const counts = await countRunPoints(run.id)
    const offending = check.offending.map(o => ({ name: o.name, index: o.index, residualNorm: Number.isFinite(o.residualNorm) ? o.residualNorm : null, reason: o.reason }))
    return { accepted: false, pointCount: counts.points, specialCount: counts.special, offending, reason }
  }
  const rows = [
    ...batch.points.map(({ index, lambda, diagnostics, ...rest }) => ({
      runId: run.id, index, lambda, residual: check.residuals.points.get(index)!,
      state: JSON.stringify(rest), diagnostics: JSON.stringify({ ...diagnostics, ...(rest.sigmaMin !== undefined ? { sigmaMin: rest.sigmaMin } : {}) }), specialKind: null,
    })),
    ...batch.specialPoints.map(({ index, lambda, kind, ...rest }) => ({
      runId: run.id, index: specialRowIndex(index), lambda, residual: check.residuals.special.get(index)!,
      state: JSON.stringify(rest), diagnostics: '{}', specialKind: kind,
    })),
  ]
  const db = useDb()
  try {
    await db.transaction(async (tx) => {
      for (let i = 0; i < rows.length; i += 100) await tx.insert(tables.runPoints).values(rows.slice(i, i + 100))
    })
  } catch (e) {
    if (/UNIQUE/i.test(String((e as { cause?: unknown }).cause ?? e))) throw httpError(409, 'point_exists', 'A point with one of these indices is already saved.')
    throw e
  }
  const counts = await countRunPoints(run.id)
  await db.update(tables.runs).set({ pointCount: counts.points, specialCount: counts.special }).where(eq(tables.runs.id, run.id))
  return { accepted: true, pointCount: counts.points, specialCount: counts.special, offending: [] }
}
