/**
 * Damped Newton for F(x) = 0 with a backtracking line search on ‖F‖ (Armijo-type sufficient
 * decrease, J. E. Dennis, R. B. Schnabel, Numerical Methods for Unconstrained Optimization and
 * Nonlinear Equations, 1983, §6.3). Square systems use the LU decomposition of ml-matrix;
 * rectangular or singular ones the SVD least-squares step (Gauss–Newton), which handles
 * consistent over-determined systems such as the plane balance with the scale fixed.
 * A problem may instead provide its own linear step (`step`, e.g. a sparse factorisation); the
 * dense Jacobian is then only the fallback where that step has none.
 */
import { LuDecomposition, Matrix, solve } from 'ml-matrix'
import { norm2 } from '../linalg/vectors'

/** The problem: unknowns x, equations F(x), dense Jacobian ∂F/∂x. */
export interface NewtonProblem {
  x0: Float64Array
  residual: (x: Float64Array) => Float64Array
  /** Dense Jacobian; needed unless `step` is given (then only used where `step` returns null). */
  jacobian?: (x: Float64Array) => Matrix
  /** Newton step dx solving J dx ≈ −F(x) (least squares if J is not square); null: none found. */
  step?: (x: Float64Array, f: Float64Array) => Float64Array | null
  /** Norm reported and tested against the tolerance (default ‖F‖₂). */
  norm?: (x: Float64Array) => number
  /** False for points the line search must not accept (for instance a collapsed edge). */
  admissible?: (x: Float64Array) => boolean
  /**
   * Optional merit function with its directional derivative along the Newton step (negative
   * for a descent direction). A step is accepted when ‖F‖ or the merit decreases sufficiently
   * (‖F‖ alone can stall where the merit still descends, and the reverse: measured on the
   * balance solve, accepting either converged on more patterns than the merit alone).
   */
  merit?: { value: (x: Float64Array) => number, slope: (x: Float64Array, dx: Float64Array) => number }
}

/** Newton result; failure to converge is a result, not a throw. */
export interface NewtonResult {
  converged: boolean
  iterations: number
  residualNorm: number
  x: Float64Array
  reason?: string
}

/** Newton settings (already validated by the caller). */
export interface NewtonSettings {
  maxIterations: number
  tolerance: number
}

/** Newton step −J⁻¹F (LU when square and regular, otherwise SVD least squares). */
function newtonStep(j: Matrix, f: Float64Array): Float64Array {
  const rhs = Matrix.columnVector(Array.from(f, x => -x))
  if (j.rows === j.columns) {
    const lu = new LuDecomposition(j)
    if (!lu.isSingular()) return Float64Array.from(lu.solve(rhs).getColumn(0))
  }
  return Float64Array.from(solve(j, rhs, true).getColumn(0))
}

/** Runs damped Newton from x0. */
export function dampedNewton(problem: NewtonProblem, s: NewtonSettings): NewtonResult {
  const norm = problem.norm ?? ((x: Float64Array) => norm2(problem.residual(x)))
  const admissible = problem.admissible ?? (() => true)
  let x = Float64Array.from(problem.x0)
  let r = norm(x)
  for (let it = 0; it < s.maxIterations; it++) {
    if (r <= s.tolerance) return { converged: true, iterations: it, residualNorm: r, x }
    if (x.length === 0) {
      return {
        converged: false, iterations: it, residualNorm: r, x,
        reason: 'nothing to move: the residual does not depend on the free unknowns',
      }
    }
    const f = problem.residual(x)
    const own = problem.step ? problem.step(x, f) : null
    if (!own && !problem.jacobian) {
      return { converged: false, iterations: it, residualNorm: r, x, reason: 'the Newton matrix could not be factorised' }
    }
    const dx = own ?? newtonStep(problem.jacobian!(x), f)
    const merit = problem.merit
    const m0 = merit ? merit.value(x) : 0
    const slope = merit ? merit.slope(x, dx) : 0
    let t = 1, accepted = false
    for (let k = 0; k < 60; k++, t /= 2) {
      const trial = x.map((xi, i) => xi + t * dx[i]!)
      if (!admissible(trial)) continue
      const rt = norm(trial)
      const normDown = rt < (1 - 1e-4 * t) * r
      const meritDown = merit !== undefined && slope < 0 && merit.value(trial) <= m0 + 1e-4 * t * slope
      const accept = normDown || meritDown
      if (accept) { x = trial; r = rt; accepted = true; break }
    }
    if (!accepted) {
      return {
        converged: false, iterations: it + 1, residualNorm: r, x,
        reason: 'the line search found no decrease of the residual (no balanced state near this start)',
      }
    }
  }
  if (r <= s.tolerance) return { converged: true, iterations: s.maxIterations, residualNorm: r, x }
  return {
    converged: false, iterations: s.maxIterations, residualNorm: r, x,
    reason: `no convergence within ${s.maxIterations} iterations`,
  }
}
