/**
 * Factor-once / solve-many front end: compresses triplets, orders, analyses and factorises,
 * reusing the compressed pattern, ordering and symbolic LDLᵀ for every later matrix with the
 * same triplet pattern (the usual case along a continuation run).
 *
 * Method choice ('auto'): symmetric → LDLᵀ; when LDLᵀ meets a zero pivot → sparse LU;
 * unsymmetric → sparse LU; n ≤ denseBelow → dense ml-matrix LU.
 */
import { CscPattern, symmetricAdjacency } from './csc'
import { DenseFactor, tripletsToDense } from './dense'
import { type LdltFactor, LdltSymbolic, ldltFactor, type Inertia } from './ldlt'
import { SupernodalSymbolic, supernodalFactor } from './supernodal'
import { type LuFactor, luFactor } from './lu'
import { approximateMinimumDegree } from './amd'
import { naturalOrdering, nestedDissection } from './ordering'
import { chooseOrdering } from './ordering-choice'
import type { Triplets } from './triplets'

/** Any factorisation made here. */
export type Factorization = LdltFactor | LuFactor | DenseFactor

/** Options of {@link SparseSolver}. */
export interface SolverOptions {
  /** 'auto' (default), 'ldlt', 'lu' or 'dense'. */
  method?: 'auto' | 'ldlt' | 'lu' | 'dense'
  /** Use dense ml-matrix when n ≤ this. Default 0 (always sparse: LDLᵀ inertia is exact pivot signs). */
  denseBelow?: number
  /**
   * 'auto' (default: AMD or nested dissection, whichever the symbolic analysis predicts to fill
   * less, ./ordering-choice.ts), 'amd', 'nested-dissection' or 'natural'.
   */
  ordering?: 'auto' | 'amd' | 'nested-dissection' | 'natural'
  /** Leaf size of the nested dissection. Default 64. */
  leafSize?: number
  /** LU threshold for keeping the diagonal pivot. Default 0.1. */
  pivotTolerance?: number
  /**
   * Numeric LDLᵀ: 'supernodal' (default; multifrontal with dense blocks, ./supernodal.ts) or
   * 'up-looking' (one row at a time, ./ldlt.ts; the reference in tests). Same pivots up to rounding.
   */
  ldlt?: 'supernodal' | 'up-looking'
}

/** Defaults of {@link SolverOptions}. */
export const DEFAULT_SOLVER_OPTIONS: Required<SolverOptions> = {
  method: 'auto', denseBelow: 0, ordering: 'auto', leafSize: 64, pivotTolerance: 0.1, ldlt: 'supernodal',
}

/** Fill defaults and reject nonsense. */
export function resolveSolverOptions(o: SolverOptions = {}): Required<SolverOptions> {
  const r = { ...DEFAULT_SOLVER_OPTIONS, ...o }
  if (!['auto', 'ldlt', 'lu', 'dense'].includes(r.method)) throw new Error(`solver: unknown method '${r.method}'`)
  if (!['auto', 'amd', 'nested-dissection', 'natural'].includes(r.ordering)) throw new Error(`solver: unknown ordering '${r.ordering}'`)
  if (!(Number.isInteger(r.denseBelow) && r.denseBelow >= 0)) throw new Error('solver: denseBelow must be an integer ≥ 0')
  if (!(Number.isInteger(r.leafSize) && r.leafSize >= 1)) throw new Error('solver: leafSize must be an integer ≥ 1')
  if (!(r.pivotTolerance > 0 && r.pivotTolerance <= 1)) throw new Error('solver: pivotTolerance must be in (0, 1]')
  if (!['supernodal', 'up-looking'].includes(r.ldlt)) throw new Error(`solver: unknown ldlt variant '${r.ldlt}'`)
  return r
}

/** Outcome of {@link SparseSolver.factor}: a factorisation, or the reason there is none. */
export type FactorOutcome =
  | { ok: true; factor: Factorization; inertia?: Inertia }
  | { ok: false; reason: string }

/** Factorises matrices, caching pattern-only work between calls with the same triplet pattern. */
export class SparseSolver {
  readonly options: Required<SolverOptions>
  private pattern?: CscPattern
  private perm?: Int32Array
  private symbolic?: LdltSymbolic | SupernodalSymbolic
  /** Number of times the pattern analysis (compression + ordering) was (re)done. */
  analyses = 0

  constructor(options: SolverOptions = {}) { this.options = resolveSolverOptions(options) }

  /** Ordering chosen at the last pattern analysis ('auto' resolves to 'amd' or 'nested-dissection'). */
  orderingUsed?: 'amd' | 'nested-dissection' | 'natural'

  private order(pattern: CscPattern): Int32Array {
    const o = this.options
    if (o.ordering === 'natural') { this.orderingUsed = 'natural'; return naturalOrdering(pattern.nRows) }
    if (o.ordering === 'auto') {
      const c = chooseOrdering(pattern, o.leafSize)
      this.orderingUsed = c.chosen
      return c.perm
    }
    const { ptr, adj } = symmetricAdjacency(pattern)
    this.orderingUsed = o.ordering
    return o.ordering === 'amd' ? approximateMinimumDegree(ptr, adj) : nestedDissection(ptr, adj, { leafSize: o.leafSize })
  }

  /** Factorise the square matrix given by `t`; `symmetric` says A = Aᵀ (enables LDLᵀ and inertia). */
  factor(t: Triplets, symmetric: boolean): FactorOutcome {
    if (t.nRows !== t.nCols) throw new Error(`solver: matrix must be square, got ${t.nRows}×${t.nCols}`)
    const o = this.options
    if (o.method === 'dense' || t.nRows <= o.denseBelow) {
      const f = new DenseFactor(tripletsToDense(t), symmetric)
      if (f.singular) return { ok: false, reason: 'singular (dense LU has a zero pivot)' }
      return { ok: true, factor: f, inertia: f.inertia }
    }
    if (!this.pattern || !this.pattern.matches(t)) {
      this.pattern = new CscPattern(t.nRows, t.nCols, t)
      this.perm = this.order(this.pattern)
      this.symbolic = undefined
      this.analyses++
    }
    const A = this.pattern.fill(t)
    let ldltReason = ''
    if (symmetric && o.method !== 'lu') {
      this.symbolic ??= o.ldlt === 'supernodal' ? new SupernodalSymbolic(this.pattern, this.perm!) : new LdltSymbolic(this.pattern, this.perm!)
      const r = this.symbolic instanceof SupernodalSymbolic ? supernodalFactor(A, this.symbolic) : ldltFactor(A, this.symbolic)
      if (r.ok) return { ok: true, factor: r.factor, inertia: r.factor.inertia }
      ldltReason = `LDLᵀ: ${r.reason}; `
      if (o.method === 'ldlt') return { ok: false, reason: ldltReason }
    }
    const r = luFactor(A, this.perm!, { pivotTolerance: o.pivotTolerance })
    if (!r.ok) return { ok: false, reason: `${ldltReason}LU: ${r.reason}` }
    return { ok: true, factor: r.factor }
  }
}
