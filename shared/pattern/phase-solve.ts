/**
 * Phase solve and phase rigidity (domain.md §5). The solve is damped Newton on the vertex phases
 * ψ with ψ of the first vertex pinned (the global shift is a symmetry) and α, K fixed.
 * Phase rigidity: the Jacobian ∂G/∂ψ restricted to the complement of the constants; its
 * eigenvalues are divided by the mean weight K̄ to be dimensionless. Phase-rigid ⇔ rank V − c
 * (connected: V − 1) ⇔ σ_min/K̄ > tolerance.
 */
import type { PatternModel } from './model'
import { dampedNewton } from './newton'
import { phaseJacobian, phaseResidual } from './phases'
import { inertiaOf, reducedSpectrum, tripletsToDense, type Inertia } from './spectrum'
import { norm2 } from './vector'
import { sparseRigidity } from './rigidity-sparse'
import { SparseSolver } from '../linalg/solver'
import { TripletBuilder } from '../linalg/triplets'

/** Options of the phase solve. */
export interface PhaseSolveOptions {
  /** Newton iterations at most (default 60). */
  maxIterations?: number
  /** Converged when ‖G‖₂ / K̄ ≤ tolerance (default 1e-12). */
  tolerance?: number
}

export const DEFAULT_PHASE_SOLVE_OPTIONS: Required<PhaseSolveOptions> = { maxIterations: 60, tolerance: 1e-12 }

/** Fills defaults and rejects nonsense. */
export function resolvePhaseSolveOptions(o: PhaseSolveOptions = {}): Required<PhaseSolveOptions> {
  const r = { ...DEFAULT_PHASE_SOLVE_OPTIONS, ...o }
  if (!(Number.isInteger(r.maxIterations) && r.maxIterations >= 0)) throw new Error('maxIterations must be an integer ≥ 0')
  if (!(r.tolerance > 0)) throw new Error('tolerance must be positive')
  return r
}

/** Mean weight K̄ (1 without edges). */
export function meanWeight(weights: Float64Array): number {
  return weights.length ? weights.reduce((s, k) => s + k, 0) / weights.length : 1
}

/** Phase solve result. */
export interface PhaseSolveResult {
  converged: boolean
  iterations: number
  /** ‖G‖₂ / K̄ at the end. */
  residualNorm: number
  psi: Float64Array
  reason?: string
}

/** Vertices up to which a singular phase Jacobian falls back to the dense least-squares step. */
const DENSE_FALLBACK_MAX_VERTICES = 800

/** Solves G(ψ) = 0 from psi0 with α and the weights fixed. */
export function solvePhases(
  m: PatternModel, psi0: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  options?: PhaseSolveOptions,
): PhaseSolveResult {
  const o = resolvePhaseSolveOptions(options)
  const kBar = meanWeight(weights)
  const V = m.nVertices
  const embed = (x: Float64Array) => { const p = Float64Array.from(psi0); p.set(x, 1); return p }
  // sparse LDLᵀ (LU when a pivot vanishes) of the pinned Jacobian; dense SVD only for small singular ones
  const solver = new SparseSolver()
  const r = dampedNewton({
    x0: psi0.slice(1),
    residual: x => phaseResidual(m, embed(x), alpha, weights).slice(1),
    step: (x, f) => {
      const j = phaseJacobian(m, embed(x), alpha, weights)
      const b = new TripletBuilder(V - 1, V - 1, j.count)
      for (let k = 0; k < j.count; k++) if (j.rows[k]! > 0 && j.cols[k]! > 0) b.add(j.rows[k]! - 1, j.cols[k]! - 1, j.values[k]!)
      const fac = solver.factor(b.build(), true)
      return fac.ok ? fac.factor.solve(f.map(v => -v)) : null
    },
    ...(V <= DENSE_FALLBACK_MAX_VERTICES ? { jacobian: (x: Float64Array) => tripletsToDense(phaseJacobian(m, embed(x), alpha, weights)).subMatrix(1, V - 1, 1, V - 1) } : {}),
    norm: x => norm2(phaseResidual(m, embed(x), alpha, weights)) / kBar,
  }, o)
  return {
    converged: r.converged, iterations: r.iterations, residualNorm: r.residualNorm, psi: embed(r.x),
    ...(r.reason ? { reason: r.reason } : {}),
  }
}

/** Phase rigidity of ψ: dimensionless σ_min, inertia, the weakest phase mode. */
export interface PhaseRigidityResult {
  method: 'dense' | 'sparse'
  /** Set when the sparse Lanczos iteration did not settle. */
  reason?: string
  dimension: number
  sigmaMin: number | null
  inertia: Inertia | null
  /** Reduced eigenvalues / K̄, ascending. */
  eigenvalues: number[]
  rigid: boolean | null
  /** Unit phase displacement per vertex of the weakest mode. */
  weakestMode: number[]
  tolerance: number
}

/** Phase rigidity: dense reduced spectrum up to maxDenseVertices, sparse LDLᵀ + Lanczos above. */
export function analyzePhaseRigidity(
  m: PatternModel, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  tolerance: number, maxDenseVertices: number,
): PhaseRigidityResult {
  const kBar = meanWeight(weights)
  if (m.nVertices > maxDenseVertices) {
    const s = sparseRigidity(phaseJacobian(m, psi, alpha, weights), [new Float64Array(m.nVertices).fill(1)], [0], tolerance * kBar)
    const sigmaMin = s.sigmaMin / kBar
    return {
      method: 'sparse', dimension: s.dimension, sigmaMin, inertia: s.inertia, eigenvalues: [],
      rigid: sigmaMin > tolerance, weakestMode: Array.from(s.mode), tolerance,
      ...(s.converged ? {} : { reason: `Lanczos on the inverse did not settle in ${s.iterations} solves` }),
    }
  }
  const s = reducedSpectrum(phaseJacobian(m, psi, alpha, weights), [new Float64Array(m.nVertices).fill(1)])
  const eigenvalues = s.eigenvalues.map(l => l / kBar)
  const sigmaMin = s.dimension === 0 ? null : s.sigmaMin / kBar
  return {
    method: 'dense',
    dimension: s.dimension,
    sigmaMin,
    inertia: inertiaOf(eigenvalues, tolerance),
    eigenvalues,
    rigid: sigmaMin === null ? true : sigmaMin > tolerance,
    weakestMode: s.weakestMode,
    tolerance,
  }
}
