/**
 * Two-parameter curves as one-parameter continuation problems (Keller 1977 pseudo-arclength on
 * the curve): y = (u, b), λ = a.
 *
 * Rigidity loss (F_u singular) by the minimally augmented system (W. Govaerts, Numerical Methods
 * for Bifurcations of Dynamical Equilibria, SIAM 2000, §4.3, the fold/limit-point case):
 *   F(u, a, b) = 0,  g(u, a, b) = 0,  [[F_u, β], [γᵀ, 0]] (v, g) = (0, 1),
 * with β, γ fixed approximate right and left null vectors of F_u at the start. g is smooth and
 * vanishes exactly where F_u is singular while the bordered matrix stays regular.
 * The Jacobian of the augmented system is taken by central differences (dense): the curve is
 * still exact to the residual tolerance, only Newton's rate depends on it. Meant for patterns of
 * a few dozen unknowns (the curve tracer, not the sweep).
 */
import { Matrix, SingularValueDecomposition, solve } from 'ml-matrix'
import type { ContinuationProblem } from '../continuation/types'
import { tripletsToDense } from '../linalg/dense'
import type { Triplets } from '../linalg/triplets'

/** F(u, a, b) = 0 with u ∈ Rⁿ and two parameters. */
export interface TwoParameterProblem {
  n: number
  residual(u: Float64Array, a: number, b: number, out: Float64Array): void
  /** F_u (analytic). */
  jacobianU(u: Float64Array, a: number, b: number): Triplets
}

/** Right and left singular vectors of the smallest singular value of F_u (ml-matrix SVD). */
export function nullVectors(p: TwoParameterProblem, u: Float64Array, a: number, b: number): { right: Float64Array; left: Float64Array; sigma: number } {
  const svd = new SingularValueDecomposition(tripletsToDense(p.jacobianU(u, a, b)))
  const k = p.n - 1
  return { right: Float64Array.from(svd.rightSingularVectors.getColumn(k)), left: Float64Array.from(svd.leftSingularVectors.getColumn(k)), sigma: svd.diagonal[k]! }
}

/** g(u, a, b) of the minimally augmented system with borders β (right), γ (left). */
export function augmentedTest(p: TwoParameterProblem, u: Float64Array, a: number, b: number, beta: Float64Array, gamma: Float64Array): number {
  const n = p.n
  const M = Matrix.zeros(n + 1, n + 1)
  M.setSubMatrix(tripletsToDense(p.jacobianU(u, a, b)), 0, 0)
  for (let i = 0; i < n; i++) { M.set(i, n, beta[i]!); M.set(n, i, gamma[i]!) }
  const rhs = Matrix.zeros(n + 1, 1); rhs.set(n, 0, 1)
  return solve(M, rhs).get(n, 0)
}

/** A dense full triplet pattern (fixed between calls, as the engine wants). */
function denseTriplets(J: Float64Array[], n: number): Triplets {
  const rows = new Int32Array(n * n), cols = new Int32Array(n * n), values = new Float64Array(n * n)
  for (let i = 0, k = 0; i < n; i++) for (let j = 0; j < n; j++, k++) { rows[k] = i; cols[k] = j; values[k] = J[j]![i]! }
  return { nRows: n, nCols: n, rows, cols, values, count: n * n }
}

/**
 * A continuation problem (y ∈ R^N, λ) from a residual alone; F_y and F_λ by central differences.
 * `h` is the relative difference step (default 1e-6).
 */
export function finiteDifferenceProblem(N: number, residual: (y: Float64Array, l: number, out: Float64Array) => void, h = 1e-6): ContinuationProblem {
  const fp = new Float64Array(N), fm = new Float64Array(N)
  const column = (y: Float64Array, l: number, j: number): Float64Array => {
    const yp = y.slice(), ym = y.slice()
    let lp = l, lm = l
    const s = h * (1 + Math.abs(j < N ? y[j]! : l))
    if (j < N) { yp[j]! += s; ym[j]! -= s } else { lp += s; lm -= s }
    residual(yp, lp, fp); residual(ym, lm, fm)
    return Float64Array.from(fp, (v, i) => (v - fm[i]!) / (2 * s))
  }
  return {
    n: N,
    residual,
    jacobian(y, l) {
      const cols = Array.from({ length: N }, (_, j) => column(y, l, j))
      return { Fu: denseTriplets(cols, N), Flambda: column(y, l, N) }
    },
    sigmaMin: false,
  }
}

/** The rigidity-loss curve problem: y = (u, b), λ = a, N = n + 1 (minimally augmented). */
export function rigidityLossCurveProblem(p: TwoParameterProblem, beta: Float64Array, gamma: Float64Array): ContinuationProblem {
  const n = p.n
  const F = new Float64Array(n)
  return finiteDifferenceProblem(n + 1, (y, a, out) => {
    const u = y.subarray(0, n), b = y[n]!
    p.residual(u, a, b, F)
    out.set(F)
    out[n] = augmentedTest(p, u, a, b, beta, gamma)
  })
}
