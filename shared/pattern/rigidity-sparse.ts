/**
 * Rigidity (balance and phase) of large patterns with the sparse LDLᵀ of shared/linalg (dense eigen-decomposition
 * costs O(V³) and memory O(V²): out of reach past a few hundred vertices).
 *
 * Reduction by pinning. Let T be the trivial motions (translations; plus the dilation in the
 * plane) and C a set of |T| coordinates on which T is invertible (both coordinates of vertex 0,
 * and in the plane the coordinate where p differs most from vertex 0). With E the unit vectors
 * of the other coordinates, S = [T | E] is invertible and, since J·T = 0,
 *   Sᵀ J S = diag(0, J_red),   J_red = Eᵀ J E  (J with the rows/columns of C removed).
 * Sylvester's law of inertia then gives inertia(J on T⊥) = inertia(J_red): the negative-pivot
 * count of one LDLᵀ of J_red is exact (J. J. Sylvester, 1852; G. H. Golub, C. F. Van Loan,
 * Matrix Computations, 4th ed. 2013, §8.1).
 *
 * σ_min of J on T⊥ (the same number the dense path reports): for b ⊥ T the vector E J_red⁻¹ Eᵀ b
 * solves J x = b (its residual lies in T⊥ and vanishes off C, hence vanishes), so
 * P·E·J_red⁻¹·Eᵀ, with P the orthogonal projector onto T⊥, is the inverse of J restricted to T⊥.
 * Lanczos with that operator (full reorthogonalisation, restarted from the Ritz vector every
 * 40 steps; C. Lanczos 1950, Golub–Van Loan §10.1) converges to the eigenvector of smallest |λ|
 * (the weakest mode) in far fewer solves than inverse iteration when the lowest eigenvalues
 * cluster, as on large lattices; σ_min is its Rayleigh quotient with J itself, accepted once
 * ‖J x − ρ x‖ ≤ 1e-6·max(|ρ|, δ) (checked every second step from the fourth).
 *
 * Zero band, as in the dense path: eigenvalues with |λ|·ℓ̄ ≤ tolerance count as zero. Sparse mode
 * counts them on J_red from the pivots of J_red ± δ·I with δ = tolerance/ℓ̄ (same signs as the
 * reduced J away from the band, by Sylvester; the band itself is measured on J_red).
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix'
import { SparseSolver, type Factorization } from '../linalg/solver'
import type { Inertia } from '../linalg/ldlt'
import { TripletBuilder, type Triplets } from '../linalg/triplets'
import { dot } from '../linalg/vectors'

/** Result of {@link sparseRigidity}; lengths not yet multiplied by ℓ̄. */
export interface SparseRigidityRaw {
  /** Smallest |eigenvalue| of J on T⊥ (Rayleigh quotient of the converged vector). */
  sigmaMin: number
  /** Unit weakest mode (2V, orthogonal to T). */
  mode: Float64Array
  inertia: Inertia
  /** Solves (Lanczos steps) used and whether the eigen-pair residual test passed. */
  iterations: number
  converged: boolean
  /** Size of J_red. */
  dimension: number
  /** 'ldlt' when J_red factorised; 'shifted' when it was singular and J_red + δI served. */
  factorisation: 'ldlt' | 'lu' | 'shifted'
}

/** Orthonormal basis of span(T) by modified Gram–Schmidt (drops dependent vectors). */
function orthonormalise(t: Float64Array[]): Float64Array[] {
  const q: Float64Array[] = []
  for (const v of t) {
    const w = Float64Array.from(v)
    for (const u of q) { const d = dot(u, w); for (let i = 0; i < w.length; i++) w[i]! -= d * u[i]! }
    const n = Math.sqrt(dot(w, w))
    if (n > 1e-12 * Math.sqrt(dot(v, v))) { for (let i = 0; i < w.length; i++) w[i]! /= n; q.push(w) }
  }
  return q
}

function project(q: Float64Array[], x: Float64Array): void {
  for (const u of q) { const d = dot(u, x); for (let i = 0; i < x.length; i++) x[i]! -= d * u[i]! }
}

/** y = J x for triplets J. */
function multiply(j: Triplets, x: Float64Array, y: Float64Array): void {
  y.fill(0)
  for (let k = 0; k < j.count; k++) y[j.rows[k]!]! += j.values[k]! * x[j.cols[k]!]!
}

/** Coordinates to pin: vertex 0's two, plus (plane) the coordinate where p differs most from it. */
export function pinnedCoordinates(p: Float64Array, plane: boolean): number[] {
  const pins = [0, 1]
  if (!plane) return pins
  let best = -1, size = 0
  for (let c = 2; c < p.length; c++) {
    const d = Math.abs(p[c]! - p[c % 2]!)
    if (d > size) { size = d; best = c }
  }
  if (best < 0) throw new Error('sparse rigidity: all vertices coincide, the dilation cannot be pinned')
  return [...pins, best]
}

/** J with the pinned rows/columns removed, plus `shift` on the diagonal (pattern kept fixed). */
function reduced(j: Triplets, pins: number[], shift: number): { t: Triplets; index: Int32Array } {
  const n = j.nRows
  const index = new Int32Array(n).fill(-1)
  let m = 0
  for (let i = 0; i < n; i++) if (!pins.includes(i)) index[i] = m++
  const b = new TripletBuilder(m, m, j.count + m)
  for (let k = 0; k < j.count; k++) {
    const r = index[j.rows[k]!]!, c = index[j.cols[k]!]!
    if (r >= 0 && c >= 0) b.add(r, c, j.values[k]!)
  }
  for (let i = 0; i < m; i++) b.add(i, i, shift)
  return { t: b.build(), index }
}

function negatives(solver: SparseSolver, t: Triplets): number | null {
  const f = solver.factor(t, true)
  return f.ok && f.inertia ? f.inertia.negative : null
}

/**
 * Sparse rigidity data of a symmetric Jacobian `j` whose kernel contains the trivial motions
 * `trivial`, reduced by removing the coordinates `pins` (T must be invertible on them: see
 * {@link pinnedCoordinates}; for phases, one vertex).
 * @param zeroBand δ: eigenvalues with |λ| ≤ δ count as zero (tolerance / ℓ̄).
 */
export function sparseRigidity(
  j: Triplets, trivial: Float64Array[], pins: number[], zeroBand: number, maxIterations = 300,
): SparseRigidityRaw {
  const n = j.nRows
  const q = orthonormalise(trivial)
  const solver = new SparseSolver()
  const plain = reduced(j, pins, 0)
  const m = plain.t.nRows
  let factor: Factorization
  let factorisation: SparseRigidityRaw['factorisation']
  let inertia: Inertia | null = null
  const f0 = solver.factor(plain.t, true)
  if (f0.ok) {
    factor = f0.factor
    factorisation = f0.inertia ? 'ldlt' : 'lu'
    if (f0.inertia) inertia = f0.inertia
  } else {
    const fs = solver.factor(reduced(j, pins, zeroBand).t, true)
    if (!fs.ok) throw new Error(`sparse rigidity: no factorisation of the reduced Jacobian (${fs.reason})`)
    factor = fs.factor
    factorisation = 'shifted'
  }

  // Lanczos on B = P E J_red⁻¹ Eᵀ (symmetric on T⊥) from a seeded start (deterministic).
  let x = new Float64Array(n)
  let seed = 12345
  for (let i = 0; i < n; i++) { seed = (seed * 1103515245 + 12345) % 2147483648; x[i] = seed / 2147483648 - 0.5 }
  project(q, x)
  normalise(x)
  const rhs = new Float64Array(m), y = new Float64Array(m), jx = new Float64Array(n)
  const applyB = (v: Float64Array): Float64Array => {
    for (let i = 0; i < n; i++) { const r = plain.index[i]!; if (r >= 0) rhs[r] = v[i]! }
    factor.solve(rhs, y)
    const w = new Float64Array(n)
    for (let i = 0; i < n; i++) { const r = plain.index[i]!; if (r >= 0) w[i] = y[r]! }
    project(q, w)
    return w
  }
  let rho = Infinity, iterations = 0, converged = false
  while (iterations < maxIterations && !converged) {
    // one Lanczos cycle with full reorthogonalisation, restarted from its Ritz vector
    const basis: Float64Array[] = [x]
    const alpha: number[] = [], beta: number[] = []
    let ritz = x
    for (let k = 0; k < LANCZOS_CYCLE && iterations < maxIterations; k++) {
      const v = basis[k]!
      const w = applyB(v)
      iterations++
      const a = dot(w, v)
      alpha.push(a)
      for (const u of basis) { const d = dot(u, w); for (let i = 0; i < n; i++) w[i]! -= d * u[i]! }
      project(q, w)
      const bk = Math.sqrt(dot(w, w))
      // Ritz pair of largest |θ| (θ = 1/λ for the eigenvalue λ of J nearest zero)
      const { theta, s: sv } = extremeRitz(alpha, beta)
      const estimate = Math.abs(bk * sv[k]!)
      const done = bk <= 1e-14 * Math.abs(a) || estimate <= 1e-9 * Math.abs(theta) || k === LANCZOS_CYCLE - 1 || iterations === maxIterations
      if (done || (k >= 3 && k % 2 === 1)) {
        ritz = new Float64Array(n)
        for (let c = 0; c <= k; c++) { const sc = sv[c]!; const u = basis[c]!; for (let i = 0; i < n; i++) ritz[i]! += sc * u[i]! }
        project(q, ritz)
        if (!normalise(ritz)) break
        multiply(j, ritz, jx)
        const r = dot(ritz, jx)
        // residual of the eigen-pair: ‖J x − ρ x‖ small relative to |ρ| (or to δ near zero)
        let res = 0
        for (let i = 0; i < n; i++) res += (jx[i]! - r * ritz[i]!) ** 2
        rho = r
        if (Math.sqrt(res) <= 1e-6 * Math.max(Math.abs(r), zeroBand)) { converged = true; break }
        if (done) break
      }
      beta.push(bk)
      for (let i = 0; i < n; i++) w[i]! /= bk
      basis.push(w)
    }
    x = ritz
    if (!converged && iterations >= maxIterations) break
  }

  if (!inertia || inertia.zero > 0 || Math.abs(rho) <= zeroBand) {
    const below = negatives(solver, reduced(j, pins, zeroBand).t) // eigenvalues < −δ
    const above = negatives(solver, reduced(j, pins, -zeroBand).t) // eigenvalues < +δ
    if (below === null || above === null) throw new Error('sparse rigidity: shifted LDLᵀ failed')
    inertia = { negative: below, zero: above - below, positive: m - above }
  }
  return { sigmaMin: Math.abs(rho), mode: x, inertia, iterations, converged, dimension: m, factorisation }
}

/** Lanczos steps per cycle before a restart from the Ritz vector. */
const LANCZOS_CYCLE = 40

/** Eigenpair of largest |θ| of the symmetric tridiagonal matrix (diagonal alpha, off-diagonal beta). */
function extremeRitz(alpha: number[], beta: number[]): { theta: number; s: number[] } {
  const k = alpha.length
  const T = Matrix.zeros(k, k)
  for (let i = 0; i < k; i++) { T.set(i, i, alpha[i]!); if (i + 1 < k) { T.set(i, i + 1, beta[i]!); T.set(i + 1, i, beta[i]!) } }
  const e = new EigenvalueDecomposition(T, { assumeSymmetric: true })
  const ev = e.realEigenvalues
  let best = 0
  for (let i = 1; i < k; i++) if (Math.abs(ev[i]!) > Math.abs(ev[best]!)) best = i
  return { theta: ev[best]!, s: e.eigenvectorMatrix.getColumn(best) }
}

function normalise(x: Float64Array): boolean {
  const s = Math.sqrt(dot(x, x))
  if (!(s > 0) || !Number.isFinite(s)) return false
  for (let i = 0; i < x.length; i++) x[i]! /= s
  return true
}
