/**
 * Dense spectrum of a symmetric sparse matrix restricted to the orthogonal complement of a known
 * (trivial) kernel: R = Qᵀ J Q with Q an orthonormal basis of span(trivial)^⊥ (Householder
 * reflectors, G. H. Golub, C. F. Van Loan, Matrix Computations, 4th ed., 2013, §5.1–5.2), then
 * the symmetric eigenvalue decomposition of ml-matrix. For a symmetric matrix the singular
 * values are |λ|, so σ_min = min |λ| and the inertia is read from the signs of λ.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix'
import { tripletsToDense } from '../linalg/dense'
import type { Inertia } from '../linalg/ldlt'
import type { Triplets } from '../linalg/triplets'
import { norm2 } from '../linalg/vectors'

/** Spectrum of the reduced matrix. */
export interface ReducedSpectrum {
  /** Dimension of the reduced space (n − number of trivial directions). */
  dimension: number
  /** Eigenvalues of R in ascending order. */
  eigenvalues: number[]
  /** min |λ| (Infinity when the reduced space is empty). */
  sigmaMin: number
  /** Unit vector in the full space (Q times the eigenvector of min |λ|); empty when dimension 0. */
  weakestMode: number[]
}

/**
 * Householder reflectors H_1 … H_k with Q = H_1 ⋯ H_k orthogonal and its first k columns
 * spanning the trivial vectors (Householder QR, Golub–Van Loan §5.2.1); the remaining n − k
 * columns of Q are an orthonormal basis of the complement. Dependent vectors are skipped.
 */
function trivialReflectors(n: number, trivial: Float64Array[]): Float64Array[] {
  const cols = trivial.map(t => Float64Array.from(t))
  const reflectors: Float64Array[] = []
  for (const x of cols) {
    for (const v of reflectors) applyReflector(v, x)
    const j = reflectors.length
    let norm = 0
    for (let i = j; i < n; i++) norm += x[i]! * x[i]!
    norm = Math.sqrt(norm)
    if (norm < 1e-12) continue
    const v = new Float64Array(n)
    for (let i = j; i < n; i++) v[i] = x[i]!
    v[j]! += x[j]! >= 0 ? norm : -norm
    const vn = norm2(v)
    for (let i = j; i < n; i++) v[i]! /= vn
    reflectors.push(v)
  }
  return reflectors
}

/** x ← (I − 2 v vᵀ) x for a unit v. */
function applyReflector(v: Float64Array, x: Float64Array): void {
  let dot = 0
  for (let i = 0; i < x.length; i++) dot += v[i]! * x[i]!
  for (let i = 0; i < x.length; i++) x[i]! -= 2 * dot * v[i]!
}

/** A ← H A H for the symmetric dense A (stored as row arrays) and H = I − 2 v vᵀ. */
function reflectBothSides(v: Float64Array, a: Float64Array[]): void {
  for (const row of a) applyReflector(v, row) // A H (rows times H; H symmetric)
  const n = a.length
  const col = new Float64Array(n)
  for (let c = 0; c < n; c++) {
    for (let r = 0; r < n; r++) col[r] = a[r]![c]!
    applyReflector(v, col)
    for (let r = 0; r < n; r++) a[r]![c] = col[r]!
  }
}

/** Eigen-decomposition of Qᵀ J Q for symmetric J, with the weakest mode mapped back. */
export function reducedSpectrum(j: Triplets, trivial: Float64Array[]): ReducedSpectrum {
  const n = j.nRows
  const hs = trivialReflectors(n, trivial)
  const k = hs.length
  const dimension = n - k
  if (dimension === 0) return { dimension, eigenvalues: [], sigmaMin: Infinity, weakestMode: [] }
  const a = tripletsToDense(j).to2DArray().map(r => Float64Array.from(r))
  for (const v of hs) reflectBothSides(v, a)
  const sym = Matrix.zeros(dimension, dimension)
  for (let r = 0; r < dimension; r++) {
    for (let c = 0; c < dimension; c++) {
      // symmetrise against rounding so the symmetric solver sees an exactly symmetric matrix
      sym.set(r, c, 0.5 * (a[k + r]![k + c]! + a[k + c]![k + r]!))
    }
  }
  const eig = new EigenvalueDecomposition(sym, { assumeSymmetric: true })
  const values = eig.realEigenvalues
  const order = values.map((_, i) => i).sort((x, y) => values[x]! - values[y]!)
  let weakest = order[0]!
  for (const i of order) if (Math.abs(values[i]!) < Math.abs(values[weakest]!)) weakest = i
  const mode = new Float64Array(n)
  for (let r = 0; r < dimension; r++) mode[k + r] = eig.eigenvectorMatrix.get(r, weakest)
  for (let i = k - 1; i >= 0; i--) applyReflector(hs[i]!, mode)
  const norm = norm2(mode)
  return {
    dimension,
    eigenvalues: order.map(i => values[i]!),
    sigmaMin: Math.abs(values[weakest]!),
    weakestMode: Array.from(mode, x => x / norm),
  }
}

/** Inertia of a list of eigenvalues with |λ| ≤ zeroTol counted as zero. */
export function inertiaOf(eigenvalues: number[], zeroTol: number): Inertia {
  const out: Inertia = { negative: 0, zero: 0, positive: 0 }
  for (const l of eigenvalues) {
    if (Math.abs(l) <= zeroTol) out.zero++
    else if (l < 0) out.negative++
    else out.positive++
  }
  return out
}
