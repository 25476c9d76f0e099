/**
 * Coordinate (triplet) form of a sparse matrix: the exchange format between problem code
 * (which assembles entries) and the sparse factorisations in this folder.
 * Duplicate (row, col) entries are summed when compressed.
 */
export interface Triplets {
  nRows: number
  nCols: number
  /** Number of stored entries (the arrays may be longer; only the first `count` are used). */
  count: number
  rows: Int32Array
  cols: Int32Array
  values: Float64Array
}

/** A growable triplet builder with typed-array storage (no per-entry object allocation). */
export class TripletBuilder {
  private rows: Int32Array
  private cols: Int32Array
  private values: Float64Array
  private n = 0

  constructor(readonly nRows: number, readonly nCols: number, capacity = 16) {
    const cap = Math.max(1, capacity)
    this.rows = new Int32Array(cap)
    this.cols = new Int32Array(cap)
    this.values = new Float64Array(cap)
  }

  /** Append entry (i, j) += v. */
  add(i: number, j: number, v: number): void {
    if (this.n === this.rows.length) this.grow()
    this.rows[this.n] = i
    this.cols[this.n] = j
    this.values[this.n] = v
    this.n++
  }

  private grow(): void {
    const cap = this.rows.length * 2
    const r = new Int32Array(cap); r.set(this.rows); this.rows = r
    const c = new Int32Array(cap); c.set(this.cols); this.cols = c
    const v = new Float64Array(cap); v.set(this.values); this.values = v
  }

  /** The entries so far (views share storage with the builder). */
  build(): Triplets {
    return {
      nRows: this.nRows,
      nCols: this.nCols,
      count: this.n,
      rows: this.rows.subarray(0, this.n),
      cols: this.cols.subarray(0, this.n),
      values: this.values.subarray(0, this.n),
    }
  }
}
