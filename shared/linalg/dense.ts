/**
 * Dense factorisation through ml-matrix (general-purpose library): the reference in tests and an
 * optional path for very small systems. Same surface as the sparse factors.
 */
import { EigenvalueDecomposition, LuDecomposition, Matrix } from 'ml-matrix'
import type { Triplets } from './triplets'
import type { Inertia } from './ldlt'

/** Dense matrix (ml-matrix) from triplets, duplicates summed. */
export function tripletsToDense(t: Triplets): Matrix {
  const M = Matrix.zeros(t.nRows, t.nCols)
  for (let k = 0; k < t.count; k++) M.set(t.rows[k]!, t.cols[k]!, M.get(t.rows[k]!, t.cols[k]!) + t.values[k]!)
  return M
}

/** A dense LU (ml-matrix) of a square matrix, with lazy transpose factor and eigen-based inertia. */
export class DenseFactor {
  readonly kind = 'dense' as const
  readonly n: number
  private readonly lu: LuDecomposition
  private luT?: LuDecomposition

  constructor(private readonly M: Matrix, private readonly symmetric = false) {
    if (!M.isSquare()) throw new Error('dense factor: matrix must be square')
    this.n = M.rows
    this.lu = new LuDecomposition(M)
  }

  /** True when U has an exactly zero pivot. */
  get singular(): boolean { return this.lu.isSingular() }

  /** Solve A x = b. */
  solve(b: ArrayLike<number>, out: Float64Array = new Float64Array(this.n)): Float64Array {
    const x = this.lu.solve(Matrix.columnVector(Array.from(b)))
    for (let i = 0; i < this.n; i++) out[i] = x.get(i, 0)
    return out
  }

  /** Solve Aᵀ x = b. */
  solveTranspose(b: ArrayLike<number>, out: Float64Array = new Float64Array(this.n)): Float64Array {
    this.luT ??= new LuDecomposition(this.M.transpose())
    const x = this.luT.solve(Matrix.columnVector(Array.from(b)))
    for (let i = 0; i < this.n; i++) out[i] = x.get(i, 0)
    return out
  }

  /** Sign of det A. */
  get detSign(): -1 | 0 | 1 { return Math.sign(this.lu.determinant) as -1 | 0 | 1 }

  /** log |det A| from the diagonal of U. */
  get logAbsDet(): number {
    const U = this.lu.upperTriangularMatrix
    let s = 0
    for (let i = 0; i < this.n; i++) s += Math.log(Math.abs(U.get(i, i)))
    return s
  }

  /**
   * Inertia from the eigenvalues (symmetric matrices only); eigenvalues with
   * |μ| ≤ 100·ε·n·max|μ| count as zero.
   */
  get inertia(): Inertia | undefined {
    if (!this.symmetric) return undefined
    return inertiaFromEigenvalues(new EigenvalueDecomposition(this.M, { assumeSymmetric: true }).realEigenvalues)
  }
}

/** Inertia of a list of eigenvalues with a relative zero threshold 100·ε·n·max|μ|. */
export function inertiaFromEigenvalues(mu: number[]): Inertia {
  const big = mu.reduce((m, v) => Math.max(m, Math.abs(v)), 0)
  const tiny = 100 * Number.EPSILON * mu.length * big
  let negative = 0, zero = 0, positive = 0
  for (const v of mu) { if (v < -tiny) negative++; else if (v > tiny) positive++; else zero++ }
  return { negative, zero, positive }
}
