/**
 * Supernodal multifrontal LDLᵀ of a symmetric matrix, P A Pᵀ = L D Lᵀ, without numerical
 * pivoting (so the signs of D give the exact inertia, as in ./ldlt.ts).
 *
 * References: I. S. Duff, J. K. Reid, "The multifrontal solution of indefinite sparse symmetric
 * linear equations", ACM Trans. Math. Softw. 9(3), 1983, 302–325; J. W. H. Liu, "The multifrontal
 * method for sparse matrix solution: theory and practice", SIAM Review 34(1), 1992, 82–109;
 * supernode amalgamation as in C. Ashcraft, R. Grimes, "The influence of relaxed supernode
 * partitions on the multifrontal method", ACM Trans. Math. Softw. 15(4), 1989, 291–309 (the
 * size/zero thresholds are the defaults of T. A. Davis's CHOLMOD, from memory).
 *
 * Symbolic (once per pattern, see {@link SupernodalSymbolic}): elimination tree of the given
 * ordering, postorder (same fill, children contiguous before parents), fundamental supernodes
 * relaxed by amalgamation, the row structure of each supernode, the map of each entry of A into
 * its front and each child's rows into its parent's front.
 * Numeric (per matrix): for each supernode in postorder, a dense front F (nr × nr, lower
 * triangle, column-major) gets the supernode's columns of A and the children's update matrices
 * (extend-add); its nc pivot columns are factorised densely, and the trailing Schur complement
 * U −= L₂₁ D L₂₁ᵀ (a blocked rank-nc update on row-major copies, 2 × 2 register tiles) is handed
 * to the parent. The fronts live in one buffer and the pending update matrices on one stack
 * (postorder makes them last-in first-out), both reused from matrix to matrix.
 */
import type { Csc } from './csc'
import { LdltFactor, LdltSymbolic, type LdltOutcome } from './ldlt'
import { invertPermutation } from './ordering'

/** Pivot columns factorised one by one before a tiled update of the panel's later columns. */
const PANEL_BLOCK = 16

/** Relaxed amalgamation thresholds: merged width ≤ n[i] allowed when the zero fraction < z[i]. */
const RELAX_COLS = [4, 16, 48] as const
const RELAX_ZEROS = [0.8, 0.1, 0.05] as const

/** Pattern-only analysis for {@link supernodalFactor}; reusable for every matrix with the pattern. */
export class SupernodalSymbolic {
  readonly n: number
  /** Ordering actually used: the given one followed by an elimination-tree postorder (same fill). */
  readonly perm: Int32Array
  readonly pinv: Int32Array
  readonly nSuper: number
  /** Supernode s holds the columns superStart[s] .. superStart[s+1]-1 (permuted numbering). */
  readonly superStart: Int32Array
  /** Rows (permuted, ascending, starting with the supernode's own columns) of supernode s. */
  readonly rowPtr: Int32Array
  readonly rows: Int32Array
  /** Parent supernode (−1 at a root). */
  readonly superParent: Int32Array
  /** Children of supernode s: childIdx[childPtr[s] .. childPtr[s+1]-1]. */
  readonly childPtr: Int32Array
  readonly childIdx: Int32Array
  /** Entries of A assembled into supernode s: aPtr[s]..aPtr[s+1]-1 index aEntry / aPos. */
  private readonly aPtr: Int32Array
  private readonly aEntry: Int32Array
  private readonly aPos: Int32Array
  /** Relative row of each update row of a child in its parent's row list (indexed like rows). */
  private readonly relPos: Int32Array
  /** Entries of L below the diagonal, explicit zeros of the amalgamation included. */
  readonly nnzL: number
  /** Σ over supernodes of the dense work (multiply-adds) of one numeric factorisation. */
  readonly flops: number
  private workspace?: Float64Array
  private readonly frontSize: number
  private readonly stackSize: number
  private stack?: Float64Array

  /** `A` may store the full symmetric pattern or one triangle; `perm` is the fill-reducing order. */
  constructor(A: Pick<Csc, 'nRows' | 'nCols' | 'colPtr' | 'rowIdx'>, perm: Int32Array) {
    const base = new LdltSymbolic(A, perm)
    const n = base.n
    this.n = n
    // postorder of the elimination tree: the subtrees become contiguous, the fill is unchanged
    const post = postorder(base.parent)
    const order = new Int32Array(n)
    for (let k = 0; k < n; k++) order[k] = perm[post[k]!]!
    // the postordered tree and column counts follow by renumbering (no second analysis)
    const postInv = new Int32Array(n)
    for (let k = 0; k < n; k++) postInv[post[k]!] = k
    this.perm = order
    this.pinv = invertPermutation(order)
    const parent = new Int32Array(n)
    const cc = new Int32Array(n) // column counts of L without the diagonal
    for (let k = 0; k < n; k++) {
      const j = post[k]!, p = base.parent[j]!
      parent[k] = p < 0 ? -1 : postInv[p]!
      cc[k] = base.Lp[j + 1]! - base.Lp[j]!
    }
    const childCount = new Int32Array(n)
    for (let j = 0; j < n; j++) if (parent[j]! >= 0) childCount[parent[j]!]!++

    // fundamental supernodes: j+1 continues j's supernode when it is j's only-child parent with one fewer entry
    const fundStart: number[] = [0]
    for (let j = 1; j < n; j++) {
      if (!(parent[j - 1] === j && cc[j - 1] === cc[j]! + 1 && childCount[j] === 1)) fundStart.push(j)
    }
    fundStart.push(n)
    const nf = fundStart.length - 1
    const colSuper = new Int32Array(n)
    for (let s = 0; s < nf; s++) for (let j = fundStart[s]!; j < fundStart[s + 1]!; j++) colSuper[j] = s
    const fParent = new Int32Array(nf)
    for (let s = 0; s < nf; s++) { const p = parent[fundStart[s + 1]! - 1]!; fParent[s] = p < 0 ? -1 : colSuper[p]! }

    // relaxed amalgamation (bottom-up): merge a child into its parent when they are contiguous
    const ncol = new Float64Array(nf), nrow = new Float64Array(nf), zeros = new Float64Array(nf)
    const first = new Int32Array(nf), rep = new Int32Array(nf)
    for (let s = 0; s < nf; s++) {
      first[s] = fundStart[s]!; rep[s] = s
      ncol[s] = fundStart[s + 1]! - fundStart[s]!
      nrow[s] = cc[fundStart[s]!]! + 1
    }
    const find = (s: number): number => { while (rep[s] !== s) { rep[s] = rep[rep[s]!]!; s = rep[s]! } return s }
    for (let s = 0; s < nf; s++) {
      if (fParent[s]! < 0) continue
      const c = find(s), p = find(fParent[s]!)
      if (first[p] !== fundStart[s + 1]) continue // not contiguous (s is not the last child)
      const nc = ncol[c]! + ncol[p]!, nr = ncol[c]! + nrow[p]!
      const z = zeros[c]! + zeros[p]! + ncol[c]! * (nr - nrow[c]!)
      const total = nc * nr - (nc * (nc - 1)) / 2
      const frac = z / total
      const ok = nc <= RELAX_COLS[0] || (nc <= RELAX_COLS[1] && frac < RELAX_ZEROS[0])
        || (nc <= RELAX_COLS[2] && frac < RELAX_ZEROS[1]) || frac < RELAX_ZEROS[2]
      if (!ok) continue
      rep[c] = p
      first[p] = first[c]!
      ncol[p] = nc; nrow[p] = nr; zeros[p] = z
    }
    const starts: number[] = []
    for (let s = 0; s < nf; s++) if (find(s) === s) starts.push(first[s]!)
    starts.sort((a, b) => a - b)
    starts.push(n)
    const ns = starts.length - 1
    this.nSuper = ns
    this.superStart = Int32Array.from(starts)
    const snode = new Int32Array(n)
    for (let s = 0; s < ns; s++) for (let j = starts[s]!; j < starts[s + 1]!; j++) snode[j] = s
    const sparent = new Int32Array(ns)
    for (let s = 0; s < ns; s++) { const p = parent[starts[s + 1]! - 1]!; sparent[s] = p < 0 ? -1 : snode[p]! }
    this.superParent = sparent

    // strict lower pattern of PAPᵀ ∪ (PAPᵀ)ᵀ by columns (rows > column, duplicates harmless)
    const { colPtr: Ap0, rowIdx: Ai0 } = A
    const pinv0 = this.pinv
    const lowCnt = new Int32Array(n + 1)
    for (let jj = 0; jj < n; jj++) {
      for (let p = Ap0[jj]!; p < Ap0[jj + 1]!; p++) { const a = pinv0[Ai0[p]!]!, b = pinv0[jj]!; if (a !== b) lowCnt[Math.min(a, b) + 1]!++ }
    }
    for (let j = 0; j < n; j++) lowCnt[j + 1]! += lowCnt[j]!
    const lowIdx = new Int32Array(lowCnt[n]!)
    const nxt = lowCnt.slice(0, n)
    for (let jj = 0; jj < n; jj++) {
      for (let p = Ap0[jj]!; p < Ap0[jj + 1]!; p++) { const a = pinv0[Ai0[p]!]!, b = pinv0[jj]!; if (a !== b) lowIdx[nxt[Math.min(a, b)]!++] = Math.max(a, b) }
    }

    // row structure of each supernode: own columns ∪ A's lower rows ∪ children's rows beyond
    const childPtr = new Int32Array(ns + 1)
    for (let s = 0; s < ns; s++) if (sparent[s]! >= 0) childPtr[sparent[s]! + 1]!++
    for (let s = 0; s < ns; s++) childPtr[s + 1]! += childPtr[s]!
    const childIdx = new Int32Array(childPtr[ns]!)
    const cn = childPtr.slice(0, ns)
    for (let s = 0; s < ns; s++) if (sparent[s]! >= 0) childIdx[cn[sparent[s]!]!++] = s
    this.childPtr = childPtr
    this.childIdx = childIdx
    const mark = new Int32Array(n).fill(-1)
    const rowPtr = new Int32Array(ns + 1)
    let rowsBuf = new Int32Array(Math.max(16, 4 * n))
    const tmp = new Int32Array(n)
    for (let s = 0; s < ns; s++) {
      const f = starts[s]!, l = starts[s + 1]! - 1
      let nt = 0
      for (let j = f; j <= l; j++) mark[j] = s
      for (let j = f; j <= l; j++) {
        for (let p = lowCnt[j]!; p < lowCnt[j + 1]!; p++) { const i = lowIdx[p]!; if (i > l && mark[i] !== s) { mark[i] = s; tmp[nt++] = i } }
      }
      for (let q = childPtr[s]!; q < childPtr[s + 1]!; q++) {
        const c = childIdx[q]!
        const cnc = starts[c + 1]! - starts[c]!
        for (let p = rowPtr[c]! + cnc; p < rowPtr[c + 1]!; p++) { const i = rowsBuf[p]!; if (i > l && mark[i] !== s) { mark[i] = s; tmp[nt++] = i } }
      }
      const sorted = tmp.subarray(0, nt).sort()
      const need = rowPtr[s]! + (l - f + 1) + nt
      if (need > rowsBuf.length) { const g = new Int32Array(Math.max(need, 2 * rowsBuf.length)); g.set(rowsBuf); rowsBuf = g }
      let w = rowPtr[s]!
      for (let j = f; j <= l; j++) rowsBuf[w++] = j
      rowsBuf.set(sorted, w); w += nt
      rowPtr[s + 1] = w
    }
    this.rowPtr = rowPtr
    this.rows = rowsBuf.slice(0, rowPtr[ns]!)
    const rows = this.rows

    // position maps: A entries into fronts, children's update rows into the parent's rows
    const pos = new Int32Array(n)
    const relPos = new Int32Array(rows.length)
    let nnzL = 0, flops = 0
    for (let s = 0; s < ns; s++) {
      const nr = rowPtr[s + 1]! - rowPtr[s]!, nc = starts[s + 1]! - starts[s]!
      for (let p = rowPtr[s]!; p < rowPtr[s + 1]!; p++) pos[rows[p]!] = p - rowPtr[s]!
      for (let q = childPtr[s]!; q < childPtr[s + 1]!; q++) {
        const c = childIdx[q]!
        const cnc = starts[c + 1]! - starts[c]!
        for (let p = rowPtr[c]! + cnc; p < rowPtr[c + 1]!; p++) relPos[p] = pos[rows[p]!]!
      }
      nnzL += nc * nr - (nc * (nc + 1)) / 2
      const m = nr - nc
      flops += nc * nc * nr / 2 + nc * m * (m + 1) / 2
    }
    this.relPos = relPos
    this.nnzL = nnzL
    this.flops = flops
    // A entries: column perm[k] of A, rows with pinv ≤ k (the upper triangle of PAPᵀ, as ldlt.ts reads)
    const { colPtr: Ap, rowIdx: Ai } = A
    const pinv = this.pinv
    const aCnt = new Int32Array(ns + 1)
    for (let jj = 0; jj < n; jj++) {
      const k = pinv[jj]!
      for (let p = Ap[jj]!; p < Ap[jj + 1]!; p++) { const i = pinv[Ai[p]!]!; if (i <= k) aCnt[snode[i]! + 1]!++ }
    }
    for (let s = 0; s < ns; s++) aCnt[s + 1]! += aCnt[s]!
    const aEntry = new Int32Array(aCnt[ns]!), aPos = new Int32Array(aCnt[ns]!)
    const an = aCnt.slice(0, ns)
    for (let jj = 0; jj < n; jj++) {
      const k = pinv[jj]!
      for (let p = Ap[jj]!; p < Ap[jj + 1]!; p++) { const i = pinv[Ai[p]!]!; if (i <= k) aEntry[an[snode[i]!]!++] = p }
    }
    // column index of each A entry (to get k back)
    const colOf = new Int32Array(Ap[n]!)
    for (let jj = 0; jj < n; jj++) for (let p = Ap[jj]!; p < Ap[jj + 1]!; p++) colOf[p] = jj
    for (let s = 0; s < ns; s++) {
      const nr = rowPtr[s + 1]! - rowPtr[s]!, f = starts[s]!
      for (let p = rowPtr[s]!; p < rowPtr[s + 1]!; p++) pos[rows[p]!] = p - rowPtr[s]!
      for (let q = aCnt[s]!; q < aCnt[s + 1]!; q++) {
        const p = aEntry[q]!
        const i = pinv[Ai[p]!]!, k = pinv[colOf[p]!]!
        aPos[q] = pos[k]! + nr * (i - f) // entry L(k, i): row k, pivot column i of the front
      }
    }
    this.aPtr = aCnt
    this.aEntry = aEntry
    this.aPos = aPos

    let maxFront = 0
    for (let s = 0; s < ns; s++) maxFront = Math.max(maxFront, (rowPtr[s + 1]! - rowPtr[s]!) ** 2)
    this.frontSize = maxFront
    // update matrices live on a stack (postorder: a supernode's children are the top entries)
    let top = 0, peak = 0
    const um = (x: number) => { const m = rowPtr[x + 1]! - rowPtr[x]! - (starts[x + 1]! - starts[x]!); return m * m }
    for (let s = 0; s < ns; s++) {
      for (let q = childPtr[s]!; q < childPtr[s + 1]!; q++) top -= um(childIdx[q]!)
      if (sparent[s]! >= 0) { top += um(s); peak = Math.max(peak, top) }
    }
    this.stackSize = peak
  }

  /** @internal numeric factorisation; see {@link supernodalFactor}. */
  factor(A: Csc): LdltOutcome {
    return numeric(this, A, this.aPtr, this.aEntry, this.aPos, this.relPos)
  }

  /** @internal one front buffer (the largest front), reused by every factorisation. */
  frontBuffer(): Float64Array { return (this.workspace ??= new Float64Array(this.frontSize)) }

  /** @internal the stack of update matrices, reused by every factorisation. */
  updateStack(): Float64Array { return (this.stack ??= new Float64Array(this.stackSize)) }
}

/** Postorder of a forest given by parent[] (children visited in increasing order). */
function postorder(parent: Int32Array): Int32Array {
  const n = parent.length
  const head = new Int32Array(n).fill(-1), next = new Int32Array(n).fill(-1)
  for (let j = n - 1; j >= 0; j--) {
    const p = parent[j]!
    if (p >= 0) { next[j] = head[p]!; head[p] = j }
  }
  const post = new Int32Array(n)
  const stack = new Int32Array(n)
  let k = 0
  for (let r = 0; r < n; r++) {
    if (parent[r] !== -1) continue
    let top = 0
    stack[0] = r
    while (top >= 0) {
      const v = stack[top]!
      const c = head[v]!
      if (c === -1) { top--; post[k++] = v } else { head[v] = next[c]!; stack[++top] = c }
    }
  }
  return post
}

function numeric(
  S: SupernodalSymbolic, A: Csc, aPtr: Int32Array, aEntry: Int32Array, aPos: Int32Array, relPos: Int32Array,
): LdltOutcome {
  const { n, nSuper: ns, superStart, rowPtr, rows, superParent } = S
  const Ax = A.values
  const work = S.frontBuffer()
  const D = new Float64Array(n)
  const Lp = new Int32Array(n + 1)
  for (let s = 0; s < ns; s++) {
    const nr = rowPtr[s + 1]! - rowPtr[s]!
    for (let j = superStart[s]!, t = 0; j < superStart[s + 1]!; j++, t++) Lp[j + 1] = nr - t - 1
  }
  for (let j = 0; j < n; j++) Lp[j + 1]! += Lp[j]!
  const Li = new Int32Array(Lp[n]!)
  const Lx = new Float64Array(Lp[n]!)
  // pending update matrices of children on a stack: offset of each supernode's, and the top
  const stack = S.updateStack()
  const offset = new Int32Array(ns)
  let top = 0
  let W = new Float64Array(64), V = new Float64Array(64)
  const { childPtr: childStart, childIdx: childList } = S

  for (let s = 0; s < ns; s++) {
    const f = superStart[s]!, nc = superStart[s + 1]! - f
    const r0 = rowPtr[s]!, nr = rowPtr[s + 1]! - r0, m = nr - nc
    const F = work.subarray(0, nr * nr)
    F.fill(0)
    for (let q = aPtr[s]!; q < aPtr[s + 1]!; q++) F[aPos[q]!]! += Ax[aEntry[q]!]!
    // extend-add of the children's update matrices (the top of the stack), then pop them
    for (let q = childStart[s]!; q < childStart[s + 1]!; q++) {
      const c = childList[q]!
      const u0 = offset[c]!
      const cnc = superStart[c + 1]! - superStart[c]!
      const cr = rowPtr[c]! + cnc
      const cm = rowPtr[c + 1]! - cr
      for (let b = 0; b < cm; b++) {
        const col = relPos[cr + b]! * nr
        const ub = u0 + b * cm
        for (let a = b; a < cm; a++) F[relPos[cr + a]! + col]! += stack[a + ub]!
      }
      if (q === childStart[s]) top = u0
    }
    // dense LDLᵀ of the nc pivot columns, in column blocks of PANEL_BLOCK: right-looking inside
    // a block, then one tiled rank-bs update of the panel's later columns
    for (let j0 = 0; j0 < nc; j0 += PANEL_BLOCK) {
      const j1 = Math.min(nc, j0 + PANEL_BLOCK)
      for (let k = j0; k < j1; k++) {
        const kk = k * nr
        const d = F[kk + k]!
        if (d === 0 || !Number.isFinite(d)) return { ok: false, reason: `zero pivot at step ${f + k} (row ${S.perm[f + k]})`, pivot: f + k }
        D[f + k] = d
        for (let j = k + 1; j < j1; j++) {
          const ljk = F[kk + j]! / d
          if (ljk === 0) continue
          const jj = j * nr
          for (let i = j; i < nr; i++) F[jj + i]! -= F[kk + i]! * ljk
        }
        for (let i = k + 1; i < nr; i++) F[kk + i]! /= d
      }
      if (j1 < nc) {
        const bs = j1 - j0, rowsBelow = nr - j1
        if (W.length < rowsBelow * bs) { W = new Float64Array(2 * rowsBelow * bs); V = new Float64Array(2 * rowsBelow * bs) }
        for (let k = 0; k < bs; k++) {
          const kk = (j0 + k) * nr, dk = D[f + j0 + k]!
          for (let i = 0; i < rowsBelow; i++) { const l = F[kk + j1 + i]!; V[i * bs + k] = l; W[i * bs + k] = l * dk }
        }
        // columns j1..nc-1 of the front, rows from the diagonal down: the same kernel on the
        // sub-front starting at (j1, j1), restricted to its first nc − j1 columns
        schurUpdate(F, rowsBelow, W, V, bs, nr, j1 * nr + j1, nc - j1)
      }
    }
    // copy L's columns out
    for (let k = 0; k < nc; k++) {
      let w = Lp[f + k]!
      const kk = k * nr
      for (let i = k + 1; i < nr; i++) { Li[w] = rows[r0 + i]!; Lx[w++] = F[kk + i]! }
    }
    if (m === 0 || superParent[s]! < 0) continue
    // Schur complement U = F₂₂ − L₂₁ D L₂₁ᵀ on row-major copies (W = L₂₁ D, V = L₂₁)
    if (W.length < m * nc) { W = new Float64Array(2 * m * nc); V = new Float64Array(2 * m * nc) }
    for (let k = 0; k < nc; k++) {
      const kk = k * nr, dk = D[f + k]!
      for (let i = 0; i < m; i++) { const l = F[kk + nc + i]!; V[i * nc + k] = l; W[i * nc + k] = l * dk }
    }
    offset[s] = top
    const U = stack.subarray(top, top + m * m)
    top += m * m
    for (let b = 0; b < m; b++) {
      const src = (nc + b) * nr + nc
      for (let a = b; a < m; a++) U[a + b * m] = F[src + a]!
    }
    schurUpdate(U, m, W, V, nc, m, 0, m)
  }
  return { ok: true, factor: new LdltFactor(S, Li, Lx, D, Lp) }
}

/**
 * Lower part of the first `cols` columns of U −= W Vᵀ, with U the m × m block at `u0` of a
 * column-major array with leading dimension `ld`, and W, V row-major m × nc; 2 × 2 tiles.
 */
function schurUpdate(U: Float64Array, m: number, W: Float64Array, V: Float64Array, nc: number, ld: number, u0: number, cols: number): void {
  let b = 0
  for (; b + 1 < cols; b += 2) {
    const vb0 = b * nc, vb1 = vb0 + nc
    const c0 = u0 + b * ld, c1 = c0 + ld
    {
      let s00 = 0, s10 = 0, s11 = 0
      const wa1 = vb1
      for (let k = 0; k < nc; k++) {
        const v0 = V[vb0 + k]!, v1 = V[vb1 + k]!
        s00 += W[vb0 + k]! * v0; s10 += W[wa1 + k]! * v0; s11 += W[wa1 + k]! * v1
      }
      U[c0 + b]! -= s00; U[c0 + b + 1]! -= s10; U[c1 + b + 1]! -= s11
    }
    let a = b + 2
    for (; a + 1 < m; a += 2) {
      const wa0 = a * nc, wa1 = wa0 + nc
      let s00 = 0, s10 = 0, s01 = 0, s11 = 0
      for (let k = 0; k < nc; k++) {
        const v0 = V[vb0 + k]!, v1 = V[vb1 + k]!, w0 = W[wa0 + k]!, w1 = W[wa1 + k]!
        s00 += w0 * v0; s10 += w1 * v0; s01 += w0 * v1; s11 += w1 * v1
      }
      U[c0 + a]! -= s00; U[c0 + a + 1]! -= s10; U[c1 + a]! -= s01; U[c1 + a + 1]! -= s11
    }
    if (a < m) {
      const wa0 = a * nc
      let s00 = 0, s01 = 0
      for (let k = 0; k < nc; k++) { const w0 = W[wa0 + k]!; s00 += w0 * V[vb0 + k]!; s01 += w0 * V[vb1 + k]! }
      U[c0 + a]! -= s00; U[c1 + a]! -= s01
    }
  }
  if (b < cols) {
    const vb0 = b * nc, c0 = u0 + b * ld
    let a = b
    for (; a + 1 < m; a += 2) {
      const wa0 = a * nc, wa1 = wa0 + nc
      let s0 = 0, s1 = 0
      for (let k = 0; k < nc; k++) { const v0 = V[vb0 + k]!; s0 += W[wa0 + k]! * v0; s1 += W[wa1 + k]! * v0 }
      U[c0 + a]! -= s0; U[c0 + a + 1]! -= s1
    }
    if (a < m) {
      const wa0 = a * nc
      let s0 = 0
      for (let k = 0; k < nc; k++) s0 += W[wa0 + k]! * V[vb0 + k]!
      U[c0 + a]! -= s0
    }
  }
}

/** Numeric supernodal LDLᵀ of a symmetric `A` (full storage, as {@link ldltFactor}) with the pattern analysed in `sym`. */
export function supernodalFactor(A: Csc, sym: SupernodalSymbolic): LdltOutcome {
  return sym.factor(A)
}
