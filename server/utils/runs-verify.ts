/**
 * Server-side verification of run points with the same core the browser ran
 * (`verifyFamilyPoints`, shared/families/verify.ts): every appended point is re-evaluated before
 * it is stored, and a finished or imported run is re-checked from what is stored.
 *
 * Sample rule for large runs: up to {@link FULL_CHECK_MAX_POINTS} regular points every point is
 * checked; above that {@link SAMPLE_POINTS} points evenly spaced by index (always the first and
 * the last) plus every special point. A run with any offending point is "rejected" and the
 * reason names the points; it never becomes "verified" later.
 */
import { formatNumber } from '#shared/format'
import { eq, sql } from 'drizzle-orm'
import { verifyFamilyPoints, type OffendingPoint } from '#shared/families/verify'
import { parseFamilySettings, type FamilySettings } from '#shared/types/family'
import { parsePatternDocument, type PatternDocument } from '#shared/types/pattern'
import type { z } from 'zod'
import type { RunPointSchema, RunSpecialPointSchema } from '#shared/types/runs'
import { VERTICAL_BALANCE_DEFINITION } from '#shared/pattern/report'
import { noticeRunVerdict } from '../mail/notices'

/** Largest max|F| a stored point may have (F is dimensionless for drawings; the engine converges to 1e-10). */
export const RUN_RESIDUAL_TOLERANCE = 1e-8
/** Runs up to this many regular points are checked point by point on finish / import. */
export const FULL_CHECK_MAX_POINTS = 2000
/** Points checked on larger runs (plus all special points). */
export const SAMPLE_POINTS = 500

type RunPoint = z.infer<typeof RunPointSchema>
type RunSpecialPoint = z.infer<typeof RunSpecialPointSchema>

/** Indices (0..n−1) checked for a run of n regular points. */
export function verificationSample(n: number): number[] {
  if (n <= FULL_CHECK_MAX_POINTS) return Array.from({ length: n }, (_, i) => i)
  const picks = new Set<number>()
  for (let k = 0; k < SAMPLE_POINTS; k++) picks.add(Math.round(k * (n - 1) / (SAMPLE_POINTS - 1)))
  return [...picks].sort((a, b) => a - b)
}

/** Outcome of checking a set of points: offending points with plain names ("point 12", "special point 0"). */
export interface PointCheck {
  ok: boolean
  checked: number
  maxResidual: number
  offending: Array<OffendingPoint & { name: string }>
  /** Residual per checked regular point index and per special point number. */
  residuals: { points: Map<number, number>, special: Map<number, number> }
}

/** Checks regular and special points against the document and settings of a run. */
export function checkPoints(doc: PatternDocument, settings: FamilySettings, points: Array<Pick<RunPoint,
  'index' | 'lambda' | 'u'>>, special: Array<Pick<RunSpecialPoint, 'index' | 'lambda' | 'u'> & { kind?: string }>): PointCheck {
  const residuals = { points: new Map<number, number>(), special: new Map<number, number>() }
  const offending: PointCheck['offending'] = []
  let maxResidual = 0
  const run = (list: typeof special, name: string, into: Map<number, number>) => {
    if (!list.length) return
    // the smallest positive tolerance lists every point with its max|F| in one pass (one problem build)
    const v = verifyFamilyPoints(doc, settings,
      list.map(p => ({ index: p.index, lambda: p.lambda, u: p.u,
      ...(p.kind ? { kind: p.kind } : {}) })), Number.MIN_VALUE)
    const found = new Map(v.offending.map(o => [o.index, o]))
    for (const p of list) {
      const o = found.get(p.index)
      const r = o ? o.residualNorm : 0
      into.set(p.index, r)
      if (Number.isNaN(r)) offending.push({ ...o!, name: `${name} ${p.index}` })
      else if (!(r <= RUN_RESIDUAL_TOLERANCE)) offending.push({ index: p.index, residualNorm: r,
        reason: `max|F| = ${formatNumber(r)}`, name: `${name} ${p.index}` })
      else maxResidual = Math.max(maxResidual, r)
    }
  }
  run(points, 'point', residuals.points)
  run(special, 'special point', residuals.special)
  return { ok: offending.length === 0, checked: points.length + special.length, maxResidual, offending, residuals }
}

/** One line naming the offending points (at most ten, then a count). */
export function rejectionReason(check: PointCheck): string {
  const shown = check.offending.slice(0, 10).map(o => `${o.name}: ${o.reason}`)
  const more = check.offending.length > 10 ? `; and ${check.offending.length - 10} more` : ''
  return `Residual check failed (tolerance ${RUN_RESIDUAL_TOLERANCE}) at ${shown.join('; ')}${more}.`
}

/** The document and parsed settings a run was computed from. */
export async function loadRunProblem(run: { graphVersionId: number,
  settings: string }): Promise<{ doc: PatternDocument, settings: FamilySettings }> {
  const version = await useDb().query.graphVersions.findFirst({ where: eq(tables.graphVersions.id,
    run.graphVersionId) })
  if (!version) throw httpError(500, 'version_missing', 'The pattern version of this run is missing.')
  return { doc: parsePatternDocument(JSON.parse(version.document)),
    settings: parseFamilySettings(JSON.parse(run.settings)) }
}

/** Marks a run rejected with the reason (it stays rejected). */
export async function rejectRun(runId: number, reason: string): Promise<void> {
  await useDb().update(tables.runs).set({ verification: 'rejected', verificationReason: reason,
    verticalBalance: VERTICAL_BALANCE_DEFINITION }).where(eq(tables.runs.id, runId))
  await noticeRunVerdict(runId)
}

/**
 * Re-checks a run from its stored rows (the sample rule of the file header) and records the
 * verdict: "verified" with the largest residual, or "rejected" naming the offending points.
 * A run already rejected, or without points, keeps its state, unless `fresh` (re-verification
 * on demand under the current definition of vertical balance: the verdict is recomputed from the
 * stored points and replaces the old one).
 */
export async function verifyStoredRun(runId: number, fresh = false): Promise<void> {
  const run = await useDb().query.runs.findFirst({ where: eq(tables.runs.id, runId) })
  if (!run || (run.verification === 'rejected' && !fresh) || run.pointCount === 0) return
  const { doc, settings } = await loadRunProblem(run)
  const picks = new Set(verificationSample(run.pointCount))
  const rows = await useDb().select().from(tables.runPoints).where(eq(tables.runPoints.runId, runId))
  const toCheck = (r: typeof rows[number]) => ({ index: r.index < 0 ? -1 - r.index : r.index, lambda: r.lambda,
    u: (JSON.parse(r.state) as { u: number[] }).u, ...(r.specialKind ? { kind: r.specialKind } : {}) })
  const regular = rows.filter(r => r.index >= 0 && picks.has(r.index)).map(toCheck)
  const special = rows.filter(r => r.index < 0).map(toCheck)
  const check = checkPoints(doc, settings, regular, special)
  const sampled = run.pointCount > FULL_CHECK_MAX_POINTS ? ` (sample of ${regular.length} of ${run.pointCount} points plus every special point)` : ''
  await useDb().update(tables.runs).set(check.ok
    ? { verification: 'verified',
      verificationReason: `Every checked point has max|F| ≤ ${RUN_RESIDUAL_TOLERANCE} (largest ${formatNumber(check.maxResidual)})${sampled}.`, verticalBalance: VERTICAL_BALANCE_DEFINITION }
    : { verification: 'rejected', verificationReason: rejectionReason(check),
      verticalBalance: VERTICAL_BALANCE_DEFINITION }).where(eq(tables.runs.id, runId))
  await noticeRunVerdict(runId) // e-mail to the author (never throws; respects the opt-out)
}

/** Counts of stored regular and special points. */
export async function countRunPoints(runId: number): Promise<{ points: number, special: number }> {
  const rp = tables.runPoints
  const row = await useDb().select({
    points: sql<number>`sum(case when ${rp.index} >= 0 then 1 else 0 end)`,
    special: sql<number>`sum(case when ${rp.index} < 0 then 1 else 0 end)`,
  }).from(rp).where(eq(rp.runId, runId)).get()
  return { points: Number(row?.points ?? 0), special: Number(row?.special ?? 0) }
}
