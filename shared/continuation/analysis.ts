/**
 * Everything computed at a corrected point: the unit tangent (null vector of [F_u F_λ], from the
 * bordered system [[F_u, F_λ], [cᵀ]] z = (0, 1) with c the previous direction, so that cᵀz = 1 > 0
 * keeps the orientation continuous), the test functions and the σ_min estimate.
 *
 * det [[J], [cᵀ]] is linear in c and equals (cᵀt)·det [[J], [tᵀ]] up to a positive factor, so its
 * sign with c = previous tangent is the sign of the bordered determinant with the new tangent.
 */
import type { BorderedMatrix, BorderedSolver } from './bordered'
import { jacobianAt } from './corrector'
import { estimateRigidityMargin, estimateSigmaMin } from './sigma-min'
import type { ContinuationProblem, TestValues } from './types'
import { norm2 } from '../linalg/vectors'

/** Data at one analysed point. */
export interface PointAnalysis {
  y: Float64Array
  t: Float64Array
  tests: TestValues
  /** log |det M| of the bordered matrix used (for a continuous branch test function). */
  detLogAbs: number
  sigma?: number
  /** Approximate null vector of F_u (from the σ_min iteration). */
  sigmaVector?: Float64Array
  /** With the problem's rigidity margin: its weakest mode in full coordinates (next point's warm start). */
  marginVector?: Float64Array
  M: BorderedMatrix
}

/**
 * Analyse the corrected point y with previous direction c. `warm`: the previous point's σ_min
 * vector (its margin vector with a rigidity margin); from it ⌈sigmaIterations/2⌉ inverse
 * iterations are made instead of sigmaIterations.
 */
export function analysePoint(problem: ContinuationProblem, solver: BorderedSolver, y: Float64Array, c: Float64Array, sigmaIterations: number, warm?: Float64Array):
  { ok: true; a: PointAnalysis } | { ok: false; reason: string } {
  const n = problem.n
  let M: BorderedMatrix
  try { M = solver.prepare(jacobianAt(problem, y), c) } catch (e) { return { ok: false, reason: `Jacobian failed: ${String(e)}` } }
  const z = M.solve(new Float64Array(n), 1)
  if (!z.ok) return { ok: false, reason: `tangent: ${z.reason}` }
  const s = norm2(z.x)
  if (!(s > 0) || !Number.isFinite(s)) return { ok: false, reason: 'tangent: zero or non-finite null vector' }
  const t = z.x.map((v) => v / s)
  const det = M.det()
  const u = y.subarray(0, n)
  const tests: TestValues = {
    tangentLambda: t[n]!,
    borderedDetSign: det?.sign ?? 0,
    events: (problem.events ?? []).map((e) => e.fn(u, y[n]!)),
  }
  if (problem.symmetric && M.fu.ok && M.fu.inertia) tests.negativeEigenvalues = M.fu.inertia.negative
  let sigma: number | undefined, sigmaVector: Float64Array | undefined, marginVector: Float64Array | undefined
  if (problem.sigmaMin !== false) {
    const iterations = warm ? Math.ceil(sigmaIterations / 2) : sigmaIterations
    const margin = problem.rigidityMargin
    if (!M.fu.ok) sigma = 0
    else if (margin) ({ sigma, vector: marginVector, reduced: sigmaVector } = estimateRigidityMargin(M.fu.factor, margin, margin.scale(u, y[n]!), iterations, warm))
    else {
      ({ sigma, vector: sigmaVector } = estimateSigmaMin(M.fu.factor, problem.symmetric === true, iterations, warm))
      if (problem.sigmaScale) sigma *= problem.sigmaScale(u, y[n]!)
    }
  }
  return { ok: true, a: { y, t, tests, detLogAbs: det?.logAbs ?? NaN, sigma, sigmaVector, ...(marginVector ? { marginVector } : {}), M } }
}
