/**
 * Newton corrector on the augmented system
 *   F(u, λ) = 0,   cᵀ y − target = 0     (y = (u, λ)),
 * which is the pseudo-arclength equation of H. B. Keller (1977) when c is the unit tangent at the
 * last point and target = cᵀy₀ + Δs; with c = e_λ it is plain Newton at fixed λ. Each iteration
 * solves one bordered system (bordered.ts). Converged when max|F| ≤ residualTolerance, or (after
 * at least one update) when the last update is ≤ stepTolerance·(1 + max|y|) and max|F| ≤
 * STALL_FACTOR·residualTolerance, which is what remains possible when F is large-scaled and its
 * rounding noise exceeds residualTolerance.
 * With `chord` the first iteration's bordered matrix is kept for all iterations (chord or
 * simplified Newton: J. M. Ortega, W. C. Rheinboldt, Iterative Solution of Nonlinear Equations
 * in Several Variables, 1970, §7.1), trading quadratic convergence for fewer factorisations.
 * A caller may hand in that matrix (`initial`): the engine passes the one already factorised at
 * the previous point, so a chord step costs no factorisation of its own.
 */
import type { ContinuationProblem } from './types'
import type { BorderedMatrix, BorderedSolver, PointJacobian } from './bordered'
import { dot, normInf } from '../linalg/vectors'

/** Largest residual, in units of residualTolerance, that the small-update rule may accept. */
export const STALL_FACTOR = 100

/** Outcome of {@link correct}. Failure is a result (`converged: false`), not a throw. */
export interface CorrectorResult {
  converged: boolean
  y: Float64Array
  iterations: number
  residualNorm: number
  reason?: string
}

/** Settings the corrector needs; `chord`: reuse the first iteration's factorisation (default false). */
export interface CorrectorSettings { maxNewtonIterations: number; residualTolerance: number; stepTolerance: number; chord?: boolean }

/** Evaluate the problem's Jacobian at y = (u, λ). */
export function jacobianAt(problem: ContinuationProblem, y: Float64Array): PointJacobian {
  const n = problem.n
  return problem.jacobian(y.subarray(0, n), y[n]!)
}

/** Max-norm of F at y. */
export function residualNormAt(problem: ContinuationProblem, y: Float64Array, work = new Float64Array(problem.n)): number {
  problem.residual(y.subarray(0, problem.n), y[problem.n]!, work)
  return normInf(work)
}

/** Newton on [F; cᵀy − target] = 0 from the guess y0. */
export function correct(
  problem: ContinuationProblem, solver: BorderedSolver, y0: Float64Array, c: Float64Array, target: number, s: CorrectorSettings,
  initial?: BorderedMatrix,
): CorrectorResult {
  const n = problem.n
  const y = y0.slice()
  const F = new Float64Array(n)
  let lastUpdate = Infinity
  let M: BorderedMatrix | undefined = s.chord ? initial : undefined
  for (let k = 0; ; k++) {
    problem.residual(y.subarray(0, n), y[n]!, F)
    const res = normInf(F)
    if (!Number.isFinite(res)) return { converged: false, y, iterations: k, residualNorm: res, reason: 'residual is not finite' }
    const constraint = dot(c, y) - target
    const constraintOk = Math.abs(constraint) <= s.stepTolerance * (1 + normInf(y))
    // The small-update rule admits rounding noise in a large-scaled F, but never a residual more
    // than STALL_FACTOR × residualTolerance: near a collapse F_u has entries ~1/length, so a tiny
    // update can hide a large residual (servers re-check points at that bound).
    const stalled = k > 0 && lastUpdate <= s.stepTolerance * (1 + normInf(y)) && res <= STALL_FACTOR * s.residualTolerance
    if (constraintOk && (res <= s.residualTolerance || stalled)) {
      return { converged: true, y, iterations: k, residualNorm: res }
    }
    if (k === s.maxNewtonIterations) return { converged: false, y, iterations: k, residualNorm: res, reason: `Newton did not converge in ${k} iterations (max|F| = ${res.toExponential(2)})` }
    if (!(s.chord && M)) {
      try { M = solver.prepare(jacobianAt(problem, y), c) } catch (e) { return { converged: false, y, iterations: k, residualNorm: res, reason: `Jacobian failed: ${String(e)}` } }
    }
    for (let i = 0; i < n; i++) F[i] = -F[i]!
    const d = M!.solve(F, -constraint)
    if (!d.ok) return { converged: false, y, iterations: k, residualNorm: res, reason: d.reason }
    for (let i = 0; i <= n; i++) y[i]! += d.x[i]!
    lastUpdate = normInf(d.x)
  }
}
