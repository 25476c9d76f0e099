/**
 * The interface a certificate needs from a nonlinear system F: Rⁿ → Rⁿ: rigorous enclosures of
 * F at a point and of F' over a box. Horizontal balance (./horizontal.ts) and vertical phase
 * balance in any row form (./phase.ts) implement it; so can any other square system.
 */

/** Interval vector as two bound arrays (lo[i] ≤ hi[i]). */
export interface IntervalVector { lo: Float64Array; hi: Float64Array }

/**
 * Interval matrix in coordinate form: entry (rows[t], cols[t]) ∋ [lo[t], hi[t]]; duplicate
 * positions sum. The pattern (rows, cols, count) must not depend on the box.
 */
export interface IntervalTriplets {
  nRows: number
  nCols: number
  count: number
  rows: Int32Array
  cols: Int32Array
  lo: Float64Array
  hi: Float64Array
}

/** A square system with enclosures. */
export interface IntervalSystem {
  /** Number of unknowns = number of equations. */
  n: number
  /** Enclosure of F(x) at the exact point x. */
  residualEnclosure(x: Float64Array): IntervalVector
  /** Enclosure of F'(y) for every y in the box [lo, hi] (componentwise). */
  jacobianEnclosure(lo: Float64Array, hi: Float64Array): IntervalTriplets
  /** Largest radius worth trying (e.g. before an edge could collapse); Infinity when none. */
  maxRadius(x: Float64Array): number
  /**
   * Natural size of the Jacobian's entries (1/mean length for balance, the mean weight for
   * phases): a Jacobian tiny on this scale is singular even when its own condition is modest.
   */
  jacobianScale?: number
}

/** Growable interval triplet builder (typed arrays, no per-entry objects). */
export class IntervalTripletBuilder {
  private rows: Int32Array
  private cols: Int32Array
  private lo: Float64Array
  private hi: Float64Array
  private n = 0

  constructor(readonly nRows: number, readonly nCols: number, capacity = 16) {
    const c = Math.max(1, capacity)
    this.rows = new Int32Array(c); this.cols = new Int32Array(c)
    this.lo = new Float64Array(c); this.hi = new Float64Array(c)
  }

  /** Entry (i, j) += [lo, hi]. */
  add(i: number, j: number, lo: number, hi: number): void {
    if (this.n === this.rows.length) this.grow()
    this.rows[this.n] = i; this.cols[this.n] = j
    this.lo[this.n] = lo; this.hi[this.n] = hi
    this.n++
  }

  private grow(): void {
    const c = 2 * this.rows.length
    const r = new Int32Array(c); r.set(this.rows); this.rows = r
    const k = new Int32Array(c); k.set(this.cols); this.cols = k
    const l = new Float64Array(c); l.set(this.lo); this.lo = l
    const h = new Float64Array(c); h.set(this.hi); this.hi = h
  }

  build(): IntervalTriplets {
    return {
      nRows: this.nRows, nCols: this.nCols, count: this.n,
      rows: this.rows.subarray(0, this.n), cols: this.cols.subarray(0, this.n),
      lo: this.lo.subarray(0, this.n), hi: this.hi.subarray(0, this.n),
    }
  }
}
