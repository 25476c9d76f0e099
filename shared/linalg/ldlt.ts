/**
 * Sparse LDLᵀ factorisation of a symmetric matrix, P A Pᵀ = L D Lᵀ (L unit lower triangular,
 * D diagonal), without numerical pivoting.
 *
 * Reference: T. A. Davis, "Algorithm 849: A concise sparse Cholesky factorization package",
 * ACM Trans. Math. Softw. 31(4), 2005, 587–591 (elimination tree and column counts by the
 * row-subtree walk; up-looking numeric factorisation, one row of L per step).
 * Elimination tree: J. W. H. Liu, "The role of elimination trees in sparse factorization",
 * SIAM J. Matrix Anal. Appl. 11(1), 1990.
 *
 * The symbolic part depends only on the pattern and the ordering and is reused for every matrix
 * with that pattern. Because no pivoting is done, an indefinite matrix can meet a zero pivot;
 * then `factor` reports failure (callers fall back to LU). When it succeeds, Sylvester's law of
 * inertia gives the inertia of A from the signs of D, and det A = Π D.
 */
import type { Csc } from './csc'
import { invertPermutation } from './ordering'

/** Pattern-only analysis: ordering, elimination tree, column pointers of L. */
export class LdltSymbolic {
  readonly n: number
  readonly perm: Int32Array
  readonly pinv: Int32Array
  readonly parent: Int32Array
  readonly Lp: Int32Array

  /** `A` may store the full symmetric pattern or one triangle; the pattern of A ∪ Aᵀ is analysed. */
  constructor(A: Pick<Csc, 'nRows' | 'nCols' | 'colPtr' | 'rowIdx'>, perm: Int32Array) {
    const n = A.nCols
    if (A.nRows !== n) throw new Error('LDLᵀ: matrix must be square')
    if (perm.length !== n) throw new Error('LDLᵀ: ordering length differs from matrix size')
    this.n = n
    this.perm = perm
    this.pinv = invertPermutation(perm)
    const { colPtr: Ap, rowIdx: Ai } = A
    // Strict upper triangle of P(A ∪ Aᵀ)Pᵀ by columns, so either storage gives the same tree.
    const { ptr, idx } = upperPatternOfPermuted(n, Ap, Ai, this.pinv)
    const parent = new Int32Array(n)
    const flag = new Int32Array(n)
    const lnz = new Int32Array(n)
    for (let k = 0; k < n; k++) {
      parent[k] = -1; flag[k] = k; lnz[k] = 0
      for (let p = ptr[k]!; p < ptr[k + 1]!; p++) {
        let i = idx[p]!
        for (; flag[i] !== k; i = parent[i]!) {
          if (parent[i] === -1) parent[i] = k
          lnz[i]!++
          flag[i] = k
        }
      }
    }
    const Lp = new Int32Array(n + 1)
    for (let k = 0; k < n; k++) Lp[k + 1] = Lp[k]! + lnz[k]!
    this.parent = parent
    this.Lp = Lp
    this.upperPtr = ptr
    this.upperIdx = idx
  }

  /** Entries of L below the diagonal. */
  get nnzL(): number { return this.Lp[this.n]! }

  /** @internal column k of the strict upper triangle of PAPᵀ: rows (permuted) < k. */
  readonly upperPtr: Int32Array
  /** @internal */
  readonly upperIdx: Int32Array
}

/** Strict-upper pattern (in permuted numbering) of P(A ∪ Aᵀ)Pᵀ, by columns. */
function upperPatternOfPermuted(n: number, Ap: Int32Array, Ai: Int32Array, pinv: Int32Array): { ptr: Int32Array; idx: Int32Array } {
  const cnt = new Int32Array(n + 1)
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const a = pinv[Ai[p]!]!, b = pinv[j]!
      if (a !== b) cnt[Math.max(a, b) + 1]!++
    }
  }
  for (let k = 0; k < n; k++) cnt[k + 1]! += cnt[k]!
  const next = cnt.slice(0, n)
  const idx = new Int32Array(cnt[n]!)
  for (let j = 0; j < n; j++) {
    for (let p = Ap[j]!; p < Ap[j + 1]!; p++) {
      const a = pinv[Ai[p]!]!, b = pinv[j]!
      if (a !== b) idx[next[Math.max(a, b)]!++] = Math.min(a, b)
    }
  }
  return { ptr: cnt, idx }
}

/** Inertia of a symmetric matrix: numbers of negative, zero and positive eigenvalues. */
export interface Inertia { negative: number; zero: number; positive: number }

/** Result of {@link ldltFactor}: either a factorisation or the pivot where it broke down. */
export type LdltOutcome = { ok: true; factor: LdltFactor } | { ok: false; reason: string; pivot: number }

/**
 * Numeric LDLᵀ of a symmetric matrix with the pattern analysed in `sym`. `A` must hold the FULL
 * symmetric matrix (both triangles); only the entries in the upper triangle of PAPᵀ are read,
 * so a slightly unsymmetric A is silently symmetrised from that triangle.
 */
export function ldltFactor(A: Csc, sym: LdltSymbolic): LdltOutcome {
  const n = sym.n
  const { parent, Lp, pinv, perm } = sym
  const Li = new Int32Array(Lp[n]!)
  const Lx = new Float64Array(Lp[n]!)
  const D = new Float64Array(n)
  const Y = new Float64Array(n)
  const flag = new Int32Array(n)
  const lnz = new Int32Array(n)
  const pattern = new Int32Array(n)
  const { colPtr: Ap, rowIdx: Ai, values: Ax } = A
  for (let k = 0; k < n; k++) {
    Y[k] = 0
    let top = n
    flag[k] = k
    lnz[k] = 0
    // Scatter column perm[k] of A restricted to permuted rows ≤ k: this is row k of PAPᵀ's lower part.
    const kk = perm[k]!
    for (let p = Ap[kk]!; p < Ap[kk + 1]!; p++) {
      let i = pinv[Ai[p]!]!
      if (i > k) continue
      Y[i]! += Ax[p]!
      let len = 0
      for (; flag[i] !== k; i = parent[i]!) { pattern[len++] = i; flag[i] = k }
      while (len > 0) pattern[--top] = pattern[--len]!
    }
    D[k] = Y[k]!
    Y[k] = 0
    for (; top < n; top++) {
      const i = pattern[top]!
      const yi = Y[i]!
      Y[i] = 0
      const p2 = Lp[i]! + lnz[i]!
      for (let p = Lp[i]!; p < p2; p++) Y[Li[p]!]! -= Lx[p]! * yi
      const lki = yi / D[i]!
      D[k]! -= lki * yi
      Li[p2] = k
      Lx[p2] = lki
      lnz[i]!++
    }
    if (D[k] === 0 || !Number.isFinite(D[k]!)) {
      return { ok: false, reason: `zero pivot at step ${k} (row ${kk})`, pivot: k }
    }
  }
  return { ok: true, factor: new LdltFactor(sym, Li, Lx, D) }
}

/** A computed P A Pᵀ = L D Lᵀ; solves and reports determinant sign and inertia. */
export class LdltFactor {
  readonly kind = 'ldlt' as const
  readonly n: number
  private readonly Lp: Int32Array
  /** `Lp` defaults to the symbolic's column pointers (the supernodal factor passes its own). */
  constructor(
    readonly symbolic: Pick<LdltSymbolic, 'n' | 'perm'>, private readonly Li: Int32Array, private readonly Lx: Float64Array,
    readonly D: Float64Array, Lp?: Int32Array,
  ) {
    this.n = symbolic.n
    const lp = Lp ?? (symbolic as Partial<LdltSymbolic>).Lp
    if (!lp) throw new Error('LdltFactor: column pointers of L missing')
    this.Lp = lp
  }

  /** Solve A x = b. */
  solve(b: ArrayLike<number>, out: Float64Array = new Float64Array(this.n)): Float64Array {
    const { n, Li, Lx, D, Lp } = this
    const { perm } = this.symbolic
    const x = new Float64Array(n)
    for (let k = 0; k < n; k++) x[k] = b[perm[k]!]!
    for (let j = 0; j < n; j++) {
      const xj = x[j]!
      for (let p = Lp[j]!; p < Lp[j + 1]!; p++) x[Li[p]!]! -= Lx[p]! * xj
    }
    for (let j = 0; j < n; j++) x[j]! /= D[j]!
    for (let j = n - 1; j >= 0; j--) {
      let s = x[j]!
      for (let p = Lp[j]!; p < Lp[j + 1]!; p++) s -= Lx[p]! * x[Li[p]!]!
      x[j] = s
    }
    for (let k = 0; k < n; k++) out[perm[k]!] = x[k]!
    return out
  }

  /** Aᵀ = A, so the same solve. */
  solveTranspose(b: ArrayLike<number>, out?: Float64Array): Float64Array { return this.solve(b, out) }

  /** Inertia from the signs of D (Sylvester's law of inertia). */
  get inertia(): Inertia {
    let negative = 0, zero = 0, positive = 0
    for (const d of this.D) { if (d < 0) negative++; else if (d > 0) positive++; else zero++ }
    return { negative, zero, positive }
  }

  /** Sign of det A (0 never occurs: a zero pivot makes the factorisation fail). */
  get detSign(): -1 | 0 | 1 { return this.inertia.negative % 2 === 0 ? 1 : -1 }

  /** log |det A| = Σ log |D_k|. */
  get logAbsDet(): number { let s = 0; for (const d of this.D) s += Math.log(Math.abs(d)); return s }

  /** Smallest |D_k| relative to the largest: a cheap (one-sided) warning sign of near-singularity. */
  get pivotRatio(): number {
    let lo = Infinity, hi = 0
    for (const d of this.D) { const a = Math.abs(d); if (a < lo) lo = a; if (a > hi) hi = a }
    return hi === 0 ? 0 : lo / hi
  }
}
