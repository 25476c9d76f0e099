/**
 * Newton on the minimally augmented fold system (W. Govaerts, Numerical Methods for Bifurcations
 * of Dynamical Equilibria, SIAM 2000, §4.3; also W. Govaerts, Yu. A. Kuznetsov, A. Dhooge,
 * "Numerical continuation of bifurcations of limit cycles in MATLAB", SIAM J. Sci. Comput. 27(1),
 * 2005, for the bordering construction):
 *
 *   F(u, λ) = 0,   g(u, λ) = 0,   where  [[F_u, b], [cᵀ, 0]] (v, g) = (0, 1),
 *
 * with b, c approximate right and left null vectors of F_u. g vanishes exactly where F_u is
 * singular, and its gradient is g_y = −wᵀ (∂F_u/∂y) v with [[F_uᵀ, c], [bᵀ, 0]] (w, h) = (0, 1).
 * Here wᵀ(∂F_u/∂y)v is the gradient of y ↦ wᵀ F_u(y) v, approximated by a central difference of
 * the analytic Jacobian: (J(u + εv, λ)ᵀw − J(u − εv, λ)ᵀw) / 2ε — two Jacobian evaluations per
 * Newton step, no second derivatives from the problem. Each step solves
 * [[F_u, F_λ], [g_yᵀ]] δ = −(F, g).
 */
import type { BorderedSolver, PointJacobian } from './bordered'
import { jacobianAt } from './corrector'
import type { ContinuationProblem } from './types'
import { normInf, normalized } from '../linalg/vectors'

/** Result of {@link refineFold}. */
export interface FoldRefinement { converged: boolean; y: Float64Array; iterations: number; lastLambdaUpdate: number }

/** Jᵀw for J = [F_u | F_λ] (length n+1). */
function jacobianTransposeTimes(J: PointJacobian, w: Float64Array, n: number): Float64Array {
  const r = new Float64Array(n + 1)
  const { Fu } = J
  for (let k = 0; k < Fu.count; k++) r[Fu.cols[k]!]! += Fu.values[k]! * w[Fu.rows[k]!]!
  let s = 0
  for (let i = 0; i < n; i++) s += J.Flambda[i]! * w[i]!
  r[n] = s
  return r
}

/** Transposed F_u as triplets (swapped index arrays; no copy of values). */
function transposeJ(J: PointJacobian): PointJacobian {
  return { Fu: { ...J.Fu, rows: J.Fu.cols, cols: J.Fu.rows }, Flambda: J.Flambda }
}

/**
 * Refine a fold from y (close to it) with right/left null-vector guesses b, c of F_u.
 * `solver` solves [[F_u, ·], [·]] systems; `solverT` the transposed ones (its own pattern cache).
 */
export function refineFold(problem: ContinuationProblem, solver: BorderedSolver, solverT: BorderedSolver, y0: Float64Array,
  b0: Float64Array, c0: Float64Array, tol: number, maxIterations: number): FoldRefinement {
  const n = problem.n
  const y = y0.slice()
  const b = normalized(b0)
  const c = problem.symmetric ? b : normalized(c0)
  const bPad = new Float64Array(n + 1); bPad.set(b)
  const cPad = new Float64Array(n + 1); cPad.set(c)
  const F = new Float64Array(n)
  let lastLambdaUpdate = Infinity
  for (let it = 1; it <= maxIterations; it++) {
    const J = jacobianAt(problem, y)
    const fu = solver.factorFu(J)
    // With F_u symmetric and c = b the augmented matrix is symmetric: w = v.
    const vg = solver.prepare({ Fu: J.Fu, Flambda: b }, cPad, fu).solve(new Float64Array(n), 1)
    const wh = problem.symmetric ? vg : solverT.prepare({ Fu: transposeJ(J).Fu, Flambda: c }, bPad).solve(new Float64Array(n), 1)
    if (!vg.ok || !wh.ok) return { converged: false, y, iterations: it, lastLambdaUpdate }
    const v = vg.x.subarray(0, n), g = vg.x[n]!, w = wh.x.subarray(0, n)
    const eps = Math.sqrt(Number.EPSILON) * (1 + normInf(y)) / Math.max(normInf(v), 1e-300)
    const up = y.slice(), um = y.slice()
    for (let i = 0; i < n; i++) { up[i]! += eps * v[i]!; um[i]! -= eps * v[i]! }
    const gp = jacobianTransposeTimes(jacobianAt(problem, up), w, n)
    const gm = jacobianTransposeTimes(jacobianAt(problem, um), w, n)
    const gy = new Float64Array(n + 1)
    for (let j = 0; j <= n; j++) gy[j] = -(gp[j]! - gm[j]!) / (2 * eps)
    problem.residual(y.subarray(0, n), y[n]!, F)
    for (let i = 0; i < n; i++) F[i] = -F[i]!
    const d = solver.prepare(J, gy, fu).solve(F, -g)
    if (!d.ok) return { converged: false, y, iterations: it, lastLambdaUpdate }
    for (let i = 0; i <= n; i++) y[i]! += d.x[i]!
    lastLambdaUpdate = Math.abs(d.x[n]!) / Math.max(1, Math.abs(y[n]!))
    if (!y.every(Number.isFinite)) return { converged: false, y, iterations: it, lastLambdaUpdate }
    if (lastLambdaUpdate <= tol && normInf(d.x) <= tol * (1 + normInf(y))) return { converged: true, y, iterations: it, lastLambdaUpdate }
  }
  return { converged: false, y, iterations: maxIterations, lastLambdaUpdate }
}
