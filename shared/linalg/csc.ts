import type { Triplets } from './triplets'

/**
 * Compressed sparse column storage on typed arrays. Column j holds rows
 * `rowIdx[colPtr[j] .. colPtr[j+1]-1]` (sorted ascending, no duplicates) with `values` alongside.
 */
export interface Csc {
  nRows: number
  nCols: number
  colPtr: Int32Array
  rowIdx: Int32Array
  values: Float64Array
}

/**
 * A compressed pattern built from a triplet list, plus the slot of each triplet in the compressed
 * arrays, so that a later triplet list with the SAME (rows, cols) sequence is compressed by one
 * scatter-add (`fill`) without sorting again. This is what lets a continuation run reuse the
 * symbolic analysis from step to step.
 */
export class CscPattern {
  readonly colPtr: Int32Array
  readonly rowIdx: Int32Array
  /** slot[k] = position in rowIdx/values of triplet k. */
  readonly slot: Int32Array
  private readonly tripletRows: Int32Array
  private readonly tripletCols: Int32Array

  constructor(readonly nRows: number, readonly nCols: number, t: Triplets) {
    checkTriplets(t)
    const { count, rows, cols } = t
    // Bucket triplets by column, then sort each column's rows and merge duplicates.
    const colCount = new Int32Array(nCols + 1)
    for (let k = 0; k < count; k++) colCount[cols[k]! + 1]!++
    for (let j = 0; j < nCols; j++) colCount[j + 1]! += colCount[j]!
    const order = new Int32Array(count)
    const next = colCount.slice()
    for (let k = 0; k < count; k++) order[next[cols[k]!]!++] = k
    const slot = new Int32Array(count)
    const colPtr = new Int32Array(nCols + 1)
    const rowTmp = new Int32Array(count)
    let nz = 0
    for (let j = 0; j < nCols; j++) {
      const a = colCount[j]!, b = colCount[j + 1]!
      const seg = Array.from(order.subarray(a, b)).sort((x, y) => rows[x]! - rows[y]!)
      colPtr[j] = nz
      let last = -1
      for (const k of seg) {
        if (rows[k] !== last) { rowTmp[nz++] = rows[k]!; last = rows[k]! }
        slot[k] = nz - 1
      }
    }
    colPtr[nCols] = nz
    this.colPtr = colPtr
    this.rowIdx = rowTmp.slice(0, nz)
    this.slot = slot
    this.tripletRows = rows.slice(0, count)
    this.tripletCols = cols.slice(0, count)
  }

  /** Number of stored (merged) entries. */
  get nnz(): number { return this.colPtr[this.nCols]! }

  /** True when `t` has exactly the (rows, cols) sequence this pattern was built from. */
  matches(t: Triplets): boolean {
    if (t.nRows !== this.nRows || t.nCols !== this.nCols || t.count !== this.slot.length) return false
    for (let k = 0; k < t.count; k++) {
      if (t.rows[k] !== this.tripletRows[k] || t.cols[k] !== this.tripletCols[k]) return false
    }
    return true
  }

  /** Sum the values of `t` (same pattern) into a CSC matrix. */
  fill(t: Triplets, out?: Float64Array): Csc {
    const values = out ?? new Float64Array(this.nnz)
    values.fill(0)
    for (let k = 0; k < t.count; k++) values[this.slot[k]!]! += t.values[k]!
    return { nRows: this.nRows, nCols: this.nCols, colPtr: this.colPtr, rowIdx: this.rowIdx, values }
  }
}

/** Throws a clear error when a triplet list is malformed (index out of range, non-finite value). */
export function checkTriplets(t: Triplets): void {
  if (!(t.nRows >= 0 && t.nCols >= 0)) throw new Error('triplets: negative dimension')
  if (t.rows.length < t.count || t.cols.length < t.count || t.values.length < t.count) {
    throw new Error('triplets: arrays shorter than count')
  }
  for (let k = 0; k < t.count; k++) {
    const i = t.rows[k]!, j = t.cols[k]!
    if (i < 0 || i >= t.nRows || j < 0 || j >= t.nCols) {
      throw new Error(`triplets: entry ${k} at (${i}, ${j}) outside ${t.nRows}×${t.nCols}`)
    }
    if (!Number.isFinite(t.values[k]!)) throw new Error(`triplets: entry ${k} at (${i}, ${j}) is not finite`)
  }
}

/** Compress triplets (duplicates summed) into CSC. */
export function tripletsToCsc(t: Triplets): Csc {
  return new CscPattern(t.nRows, t.nCols, t).fill(t)
}

/** y = A x (y overwritten). */
export function cscMultiply(A: Csc, x: ArrayLike<number>, y: Float64Array): Float64Array {
  y.fill(0)
  for (let j = 0; j < A.nCols; j++) {
    const xj = x[j]!
    if (xj === 0) continue
    for (let p = A.colPtr[j]!; p < A.colPtr[j + 1]!; p++) y[A.rowIdx[p]!]! += A.values[p]! * xj
  }
  return y
}

/** y = Aᵀ x (y overwritten). */
export function cscMultiplyTranspose(A: Csc, x: ArrayLike<number>, y: Float64Array): Float64Array {
  for (let j = 0; j < A.nCols; j++) {
    let s = 0
    for (let p = A.colPtr[j]!; p < A.colPtr[j + 1]!; p++) s += A.values[p]! * x[A.rowIdx[p]!]!
    y[j] = s
  }
  return y
}

/** Aᵀ as a new CSC matrix (rows sorted, as CSC requires). */
export function cscTranspose(A: Csc): Csc {
  const { nRows, nCols, colPtr, rowIdx, values } = A
  const nz = colPtr[nCols]!
  const ptr = new Int32Array(nRows + 1)
  for (let p = 0; p < nz; p++) ptr[rowIdx[p]! + 1]!++
  for (let i = 0; i < nRows; i++) ptr[i + 1]! += ptr[i]!
  const next = ptr.slice(0, nRows)
  const ri = new Int32Array(nz)
  const v = new Float64Array(nz)
  for (let j = 0; j < nCols; j++) {
    for (let p = colPtr[j]!; p < colPtr[j + 1]!; p++) {
      const q = next[rowIdx[p]!]!++
      ri[q] = j
      v[q] = values[p]!
    }
  }
  return { nRows: nCols, nCols: nRows, colPtr: ptr, rowIdx: ri, values: v }
}

/**
 * Adjacency lists (CSR-like) of the graph of A + Aᵀ without the diagonal: the graph the
 * fill-reducing ordering works on. A must be square.
 */
export function symmetricAdjacency(A: Pick<Csc, 'nRows' | 'nCols' | 'colPtr' | 'rowIdx'>): { ptr: Int32Array; adj: Int32Array } {
  const n = A.nCols
  if (A.nRows !== n) throw new Error('symmetricAdjacency: matrix must be square')
  const deg = new Int32Array(n + 1)
  for (let j = 0; j < n; j++) {
    for (let p = A.colPtr[j]!; p < A.colPtr[j + 1]!; p++) {
      const i = A.rowIdx[p]!
      if (i !== j) { deg[i + 1]!++; deg[j + 1]!++ }
    }
  }
  for (let i = 0; i < n; i++) deg[i + 1]! += deg[i]!
  const next = deg.slice(0, n)
  const raw = new Int32Array(deg[n]!)
  for (let j = 0; j < n; j++) {
    for (let p = A.colPtr[j]!; p < A.colPtr[j + 1]!; p++) {
      const i = A.rowIdx[p]!
      if (i !== j) { raw[next[i]!++] = j; raw[next[j]!++] = i }
    }
  }
  // Remove duplicate neighbours (entries present in both A and Aᵀ).
  const mark = new Int32Array(n).fill(-1)
  const ptr = new Int32Array(n + 1)
  let nz = 0
  for (let i = 0; i < n; i++) {
    ptr[i] = nz
    for (let p = deg[i]!; p < deg[i + 1]!; p++) {
      const j = raw[p]!
      if (mark[j] !== i) { mark[j] = i; raw[nz++] = j }
    }
  }
  ptr[n] = nz
  return { ptr, adj: raw.slice(0, nz) }
}
