/**
 * Sparse LU factorisation with threshold partial pivoting, P A Q = L U.
 *
 * Reference: J. R. Gilbert, T. Peierls, "Sparse partial pivoting in time proportional to
 * arithmetic operations", SIAM J. Sci. Stat. Comput. 9(5), 1988, 862–874 (left-looking: column k
 * of L and U comes from one sparse triangular solve L x = A(:, q_k), whose nonzero pattern is the
 * set reachable in the graph of L, found by depth-first search). Threshold pivoting with a
 * preference for the diagonal: T. A. Davis, Direct Methods for Sparse Linear Systems, SIAM 2006,
 * §6.3.
 *
 * Q is a fill-reducing column ordering chosen beforehand (from the pattern of A + Aᵀ, which suits
 * the nearly symmetric Jacobians of continuation); P comes from pivoting. L is unit lower
 * triangular (diagonal stored first in each column), U upper triangular (diagonal stored last).
 * det A = sign(P) · sign(Q) · Π U_kk.
 */
import type { Csc } from './csc'
import { invertPermutation, permutationSign } from './ordering'

/** Options of {@link luFactor}. */
export interface LuOptions {
  /** Keep the diagonal entry as pivot if |a_kk| ≥ tol · max |column|. Default 0.1. 1 = strict partial pivoting. */
  pivotTolerance?: number
}

/** Result of {@link luFactor}. */
export type LuOutcome = { ok: true; factor: LuFactor } | { ok: false; reason: string; column: number }

class Growable {
  idx: Int32Array
  val: Float64Array
  n = 0
  constructor(cap: number) { this.idx = new Int32Array(cap); this.val = new Float64Array(cap) }
  ensure(extra: number): void {
    if (this.n + extra <= this.idx.length) return
    const cap = Math.max(2 * this.idx.length, this.n + extra)
    const i = new Int32Array(cap); i.set(this.idx.subarray(0, this.n)); this.idx = i
    const v = new Float64Array(cap); v.set(this.val.subarray(0, this.n)); this.val = v
  }
  push(i: number, v: number): void { this.idx[this.n] = i; this.val[this.n++] = v }
}

/**
 * Numeric sparse LU of the square matrix A with column order `q` (`q[k]` = column of A used
 * k-th). A structurally or numerically singular matrix gives `{ ok: false }` with the column.
 */
export function luFactor(A: Csc, q: Int32Array, options: LuOptions = {}): LuOutcome {
  const n = A.nCols
  if (A.nRows !== n) throw new Error('LU: matrix must be square')
  if (q.length !== n) throw new Error('LU: column ordering length differs from matrix size')
  const tol = options.pivotTolerance ?? 0.1
  if (!(tol > 0 && tol <= 1)) throw new Error('LU: pivotTolerance must be in (0, 1]')
  const { colPtr: Ap, rowIdx: Ai, values: Ax } = A
  const nnzA = Ap[n]!
  const L = new Growable(4 * nnzA + n)
  const U = new Growable(4 * nnzA + n)
  const Lp = new Int32Array(n + 1)
  const Up = new Int32Array(n + 1)
  const pinv = new Int32Array(n).fill(-1)
  const x = new Float64Array(n)
  const xi = new Int32Array(n)
  const stack = new Int32Array(n)
  const pstack = new Int32Array(n)
  const mark = new Int32Array(n).fill(-1)

  for (let k = 0; k < n; k++) {
    Lp[k] = L.n
    Up[k] = U.n
    L.ensure(n - k + 1)
    U.ensure(k + 1)
    const col = q[k]!
    // --- reach: pattern of x = L \ A(:, col) in topological order, xi[top..n)
    let top = n
    for (let p = Ap[col]!; p < Ap[col + 1]!; p++) {
      const start = Ai[p]!
      if (mark[start] === k) continue
      let head = 0
      stack[0] = start
      while (head >= 0) {
        const j = stack[head]!
        const J = pinv[j]!
        if (mark[j] !== k) { mark[j] = k; pstack[head] = J < 0 ? 0 : Lp[J]! }
        let done = true
        const pEnd = J < 0 ? 0 : Lp[J + 1]!
        for (let pp = pstack[head]!; pp < pEnd; pp++) {
          const i = L.idx[pp]!
          if (mark[i] === k) continue
          pstack[head] = pp
          stack[++head] = i
          done = false
          break
        }
        if (done) { head--; xi[--top] = j }
      }
    }
    // --- numeric triangular solve on that pattern
    for (let p = top; p < n; p++) x[xi[p]!] = 0
    for (let p = Ap[col]!; p < Ap[col + 1]!; p++) x[Ai[p]!]! += Ax[p]!
    for (let px = top; px < n; px++) {
      const j = xi[px]!
      const J = pinv[j]!
      if (J < 0) continue
      const xj = x[j]!
      for (let p = Lp[J]! + 1; p < Lp[J + 1]!; p++) x[L.idx[p]!]! -= L.val[p]! * xj
    }
    // --- pivot choice
    let ipiv = -1, amax = -1
    for (let p = top; p < n; p++) {
      const i = xi[p]!
      if (pinv[i]! < 0) {
        const a = Math.abs(x[i]!)
        if (a > amax) { amax = a; ipiv = i }
      } else {
        U.push(pinv[i]!, x[i]!)
      }
    }
    if (ipiv === -1 || !(amax > 0) || !Number.isFinite(amax)) {
      return { ok: false, reason: `singular: no nonzero pivot in column ${col}`, column: col }
    }
    if (pinv[col]! < 0 && mark[col] === k && Math.abs(x[col]!) >= tol * amax) ipiv = col
    const pivot = x[ipiv]!
    U.push(k, pivot)
    pinv[ipiv] = k
    L.push(ipiv, 1)
    for (let p = top; p < n; p++) {
      const i = xi[p]!
      if (pinv[i]! < 0) L.push(i, x[i]! / pivot)
      x[i] = 0
    }
  }
  Lp[n] = L.n
  Up[n] = U.n
  for (let p = 0; p < L.n; p++) L.idx[p] = pinv[L.idx[p]!]!
  return {
    ok: true,
    factor: new LuFactor(n, Lp, L.idx.slice(0, L.n), L.val.slice(0, L.n), Up, U.idx.slice(0, U.n), U.val.slice(0, U.n), pinv, q),
  }
}

/** A computed P A Q = L U: solves with A and Aᵀ, determinant sign and log-magnitude. */
export class LuFactor {
  readonly kind = 'lu' as const
  constructor(
    readonly n: number,
    private readonly Lp: Int32Array, private readonly Li: Int32Array, private readonly Lx: Float64Array,
    private readonly Up: Int32Array, private readonly Ui: Int32Array, private readonly Ux: Float64Array,
    /** pinv[i] = pivot step at which row i was chosen. */
    readonly pinv: Int32Array,
    readonly q: Int32Array,
  ) {}

  /** Solve A x = b. */
  solve(b: ArrayLike<number>, out: Float64Array = new Float64Array(this.n)): Float64Array {
    const { n, Lp, Li, Lx, Up, Ui, Ux, pinv, q } = this
    const y = new Float64Array(n)
    for (let i = 0; i < n; i++) y[pinv[i]!] = b[i]!
    for (let j = 0; j < n; j++) {
      const yj = y[j]!
      for (let p = Lp[j]! + 1; p < Lp[j + 1]!; p++) y[Li[p]!]! -= Lx[p]! * yj
    }
    for (let j = n - 1; j >= 0; j--) {
      const yj = (y[j]! /= Ux[Up[j + 1]! - 1]!)
      for (let p = Up[j]!; p < Up[j + 1]! - 1; p++) y[Ui[p]!]! -= Ux[p]! * yj
    }
    for (let k = 0; k < n; k++) out[q[k]!] = y[k]!
    return out
  }

  /** Solve Aᵀ x = b (Aᵀ = Q Uᵀ Lᵀ P). */
  solveTranspose(b: ArrayLike<number>, out: Float64Array = new Float64Array(this.n)): Float64Array {
    const { n, Lp, Li, Lx, Up, Ui, Ux, pinv, q } = this
    const w = new Float64Array(n)
    for (let k = 0; k < n; k++) w[k] = b[q[k]!]!
    for (let j = 0; j < n; j++) {
      let s = w[j]!
      for (let p = Up[j]!; p < Up[j + 1]! - 1; p++) s -= Ux[p]! * w[Ui[p]!]!
      w[j] = s / Ux[Up[j + 1]! - 1]!
    }
    for (let j = n - 1; j >= 0; j--) {
      let s = w[j]!
      for (let p = Lp[j]! + 1; p < Lp[j + 1]!; p++) s -= Lx[p]! * w[Li[p]!]!
      w[j] = s
    }
    for (let i = 0; i < n; i++) out[i] = w[pinv[i]!]!
    return out
  }

  /** Sign of det A. */
  get detSign(): -1 | 0 | 1 {
    let s = permutationSign(this.pinv) * permutationSign(invertPermutation(this.q))
    for (let j = 0; j < this.n; j++) if (this.Ux[this.Up[j + 1]! - 1]! < 0) s = -s
    return s as -1 | 1
  }

  /** log |det A| = Σ log |U_kk|. */
  get logAbsDet(): number {
    let s = 0
    for (let j = 0; j < this.n; j++) s += Math.log(Math.abs(this.Ux[this.Up[j + 1]! - 1]!))
    return s
  }

  /** Entries stored in L and U (fill measure). */
  get nnz(): number { return this.Lp[this.n]! + this.Up[this.n]! }
}
