/**
 * Estimate of the smallest singular value σ_min(F_u) with the factorisation at hand: a few steps
 * of inverse iteration (G. H. Golub, C. F. Van Loan, Matrix Computations, 4th ed. 2013, §8.2.2)
 * from a fixed probe vector — on F_u itself when symmetric (|eigenvalue| = singular value), on
 * F_uᵀF_u otherwise (one solve with F_uᵀ and one with F_u per step). For a unit vector x,
 * 1/|F_u⁻¹x| ≥ σ_min, so the estimate is an UPPER bound that tightens with every step; it is
 * accurate when σ_min is well separated from the next singular value, which is exactly the case
 * near a simple rigidity loss. The last iterate is the approximate kernel direction.
 * Along a branch the weakest direction changes slowly, so the engine starts from the previous
 * point's vector (`start`) and then needs fewer steps for the same accuracy.
 */
import type { Factorization } from '../linalg/solver'
import { norm2, probeVector } from './vectors'

/** σ_min estimate and the corresponding approximate right singular vector (unit). */
export function estimateSigmaMin(f: Factorization, symmetric: boolean, iterations: number, start?: Float64Array): { sigma: number; vector: Float64Array } {
  let x = start && start.length === f.n ? start : probeVector(f.n)
  let sigma = Infinity
  for (let k = 0; k < iterations; k++) {
    const y = symmetric ? f.solve(x) : f.solve(f.solveTranspose(x))
    const s = norm2(y)
    if (!(s > 0) || !Number.isFinite(s)) return { sigma: 0, vector: x }
    sigma = symmetric ? 1 / s : Math.sqrt(1 / s)
    for (let i = 0; i < y.length; i++) y[i]! /= s
    x = y
  }
  return { sigma, vector: x }
}
