/**
 * Phase solve and phase rigidity on the level rows of vertical balance on cuts (H. Chen,
 * M. Traizet, arXiv 2103.15676, 2021, Defs 6.2, 6.6; H. Chen, Comm. Anal. Geom. 32, 2024, Def. 2).
 * The solve is damped Newton on the vertex phases ψ with the smallest vertex of each component
 * pinned (the global shift per component is a symmetry) and α, K fixed: V − c rows, V − c unknowns.
 * Phase rigidity: the (V − c) × V row Jacobian has rank V − c ⇔ its pinned square block is
 * invertible; σ_min/K̄ > tolerance. When all edges share one length the rows are the vertex sums
 * and the symmetric Laplacian path (reduced spectrum, inertia) decides, as before.
 */
import { LuDecomposition, type Matrix, SingularValueDecomposition } from 'ml-matrix'
import { estimateSigmaMin } from '../continuation/sigma-min'
import { TripletBuilder, type Triplets } from '../linalg/triplets'
import { SparseSolver } from '../linalg/solver'
import type { PatternModel } from './model'
import { dampedNewton } from './newton'
import { phaseJacobian } from './phases'
import { tripletsToDense } from '../linalg/dense'
import type { Inertia } from '../linalg/ldlt'
import { inertiaOf, reducedSpectrum } from './spectrum'
import { norm2 } from '../linalg/vectors'
import { sparseRigidity } from './rigidity-sparse'
import { levelJacobian, levelResidual, modelLevels } from './vertical-balance'
import type { LevelStructure } from './vertical-levels'

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

/** Columns of the unpinned vertices, and a map back to ψ. */
export function freePhaseColumns(V: number, s: LevelStructure): { free: number[]; column: Int32Array } {
  const pinned = new Set(s.pinned)
  const free: number[] = []
  const column = new Int32Array(V).fill(-1)
  for (let v = 0; v < V; v++) if (!pinned.has(v)) { column[v] = free.length; free.push(v) }
  return { free, column }
}

/** The row Jacobian with the pinned columns removed (square, V − c). */
export function pinnedLevelJacobian(t: Triplets, column: Int32Array, n: number): Triplets {
  const b = new TripletBuilder(t.nRows, n, t.count)
  for (let i = 0; i < t.count; i++) {
    const c = column[t.cols[i]!]!
    if (c >= 0) b.add(t.rows[i]!, c, t.values[i]!)
  }
  return b.build()
}

/**
 * Solves the level rows F(ψ) = 0 from psi0 with α and the weights fixed; `levels` defaults to the
 * structure of the model's own drawing.
 */
export function solvePhases(
  m: PatternModel, psi0: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  options?: PhaseSolveOptions, levels: LevelStructure = modelLevels(m),
): PhaseSolveResult {
  const o = resolvePhaseSolveOptions(options)
  const kBar = meanWeight(weights)
  const { free, column } = freePhaseColumns(m.nVertices, levels)
  const n = free.length
  const embed = (x: Float64Array) => { const p = Float64Array.from(psi0); free.forEach((v, i) => { p[v] = x[i]! }); return p }
  const F = (x: Float64Array) => levelResidual(m, levels, embed(x), alpha, weights)
  const pinnedJ = (x: Float64Array) => pinnedLevelJacobian(levelJacobian(m, levels, embed(x), alpha, weights), column, n)
  // one level, connected: the rows are vertex sums, a symmetric Laplacian block (LDLᵀ); otherwise LU.
  // Sparse at every size; the dense least-squares step only for small singular Jacobians.
  const symmetric = levels.singleLevel && levels.components === 1
  const solver = new SparseSolver()
  const r = dampedNewton({
    x0: Float64Array.from(free, v => psi0[v]!),
    residual: F,
    step: (x, f) => {
      const fac = solver.factor(pinnedJ(x), symmetric && false)
      return fac.ok ? fac.factor.solve(f.map(v => -v)) : null
    },
    ...(n <= DENSE_FALLBACK_MAX_VERTICES ? { jacobian: (x: Float64Array) => tripletsToDense(pinnedJ(x)) } : {}),
    norm: x => norm2(F(x)) / kBar,
  }, o)
  return {
    converged: r.converged, iterations: r.iterations, residualNorm: r.residualNorm, psi: embed(r.x),
    ...(r.reason ? { reason: r.reason } : {}),
  }
}

/** Phase rigidity of ψ: dimensionless σ_min, inertia (symmetric case), the weakest phase mode. */
export interface PhaseRigidityResult {
  method: 'dense' | 'sparse'
  /** Set when the sparse Lanczos iteration did not settle. */
  reason?: string
  /** Number of level rows (V − c) = size of the pinned square matrix. */
  dimension: number
  sigmaMin: number | null
  /** Counts of the reduced eigenvalues' signs; null when the rows are not the vertex sums (not symmetric). */
  inertia: Inertia | null
  /** Reduced eigenvalues / K̄, ascending (single-level, dense); otherwise empty. */
  eigenvalues: number[]
  /** Determinant of the pinned square matrix / K̄^dimension (dense only; null above the dense limit). */
  pinnedDeterminant: number | null
  rigid: boolean | null
  /** Unit phase displacement per vertex of the weakest mode. */
  weakestMode: number[]
  tolerance: number
}

/**
 * Phase rigidity on the level rows (`levels` defaults to the model's own drawing). Single level
 * and connected: the rows are the vertex sums, so the symmetric Laplacian spectrum decides
 * (dense ≤ maxDenseVertices, sparse LDLᵀ above). Otherwise the pinned square row Jacobian:
 * dense SVD, or above the limit sparse LU with inverse iteration on AᵀA.
 */
export function analyzePhaseRigidity(
  m: PatternModel, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  tolerance: number, maxDenseVertices: number, levels: LevelStructure = modelLevels(m),
): PhaseRigidityResult {
  const kBar = meanWeight(weights)
  const { free, column } = freePhaseColumns(m.nVertices, levels)
  const n = free.length
  const A = pinnedLevelJacobian(levelJacobian(m, levels, psi, alpha, weights), column, n)
  const embedMode = (x: ArrayLike<number>) => {
    const y = new Array<number>(m.nVertices).fill(0)
    free.forEach((v, i) => { y[v] = x[i]! })
    const s = Math.hypot(...y) || 1
    return y.map(t => t / s)
  }
  if (m.nVertices > maxDenseVertices) {
    if (levels.singleLevel && levels.components === 1) {
      const s = sparseRigidity(phaseJacobian(m, psi, alpha, weights), [new Float64Array(m.nVertices).fill(1)], [0], tolerance * kBar)
      const sigmaMin = s.sigmaMin / kBar
      return {
        method: 'sparse', dimension: s.dimension, sigmaMin, inertia: s.inertia, eigenvalues: [], pinnedDeterminant: null,
        rigid: sigmaMin > tolerance, weakestMode: Array.from(s.mode), tolerance,
        ...(s.converged ? {} : { reason: `Lanczos on the inverse did not settle in ${s.iterations} solves` }),
      }
    }
    const f = new SparseSolver().factor(A, false)
    if (!f.ok) {
      return { method: 'sparse', dimension: n, sigmaMin: 0, inertia: null, eigenvalues: [], pinnedDeterminant: null, rigid: false, weakestMode: [], tolerance, reason: f.reason }
    }
    const est = estimateSigmaMin(f.factor, false, 60)
    const sigmaMin = est.sigma / kBar
    return {
      method: 'sparse', dimension: n, sigmaMin, inertia: null, eigenvalues: [], pinnedDeterminant: null,
      rigid: sigmaMin > tolerance, weakestMode: embedMode(est.vector), tolerance,
    }
  }
  const dense = tripletsToDense(A)
  const det = n === 0 ? 1 : new LuDecomposition(dense.clone().div(kBar)).determinant
  if (levels.singleLevel && levels.components === 1) {
    const s = reducedSpectrum(phaseJacobian(m, psi, alpha, weights), [new Float64Array(m.nVertices).fill(1)])
    const eigenvalues = s.eigenvalues.map(l => l / kBar)
    const sigmaMin = s.dimension === 0 ? null : s.sigmaMin / kBar
    return {
      method: 'dense', dimension: s.dimension, sigmaMin, inertia: inertiaOf(eigenvalues, tolerance), eigenvalues,
      pinnedDeterminant: det, rigid: sigmaMin === null ? true : sigmaMin > tolerance, weakestMode: s.weakestMode, tolerance,
    }
  }
  if (n === 0) return { method: 'dense', dimension: 0, sigmaMin: null, inertia: null, eigenvalues: [], pinnedDeterminant: 1, rigid: true, weakestMode: [], tolerance }
  const svd = new SingularValueDecomposition(dense, { autoTranspose: false })
  const sv = svd.diagonal
  let k = 0
  for (let i = 1; i < sv.length; i++) if (sv[i]! < sv[k]!) k = i
  const sigmaMin = sv[k]! / kBar
  const right: Matrix = svd.rightSingularVectors
  return {
    method: 'dense', dimension: n, sigmaMin, inertia: null, eigenvalues: [], pinnedDeterminant: det,
    rigid: sigmaMin > tolerance, weakestMode: embedMode(right.getColumn(k)), tolerance,
  }
}
