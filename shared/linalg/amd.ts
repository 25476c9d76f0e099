/**
 * Fill-reducing ordering by approximate minimum degree on the quotient graph.
 *
 * Reference: P. R. Amestoy, T. A. Davis, I. S. Duff, "An approximate minimum degree ordering
 * algorithm", SIAM J. Matrix Anal. Appl. 17(4), 1996, 886–905; the compact formulation follows
 * T. A. Davis, Direct Methods for Sparse Linear Systems, SIAM 2006, §7.1 (quotient graph stored
 * in one array with elbow room and garbage collection, element absorption, aggressive absorption,
 * mass elimination, supervariables found by hashing, the approximate external degree
 * d(i) ≤ Σ_e |L_e \ L_k| + |A_i| of the paper's §3, dense rows ordered last as in its §6),
 * followed by a postorder of the assembly tree.
 *
 * No pure-JavaScript AMD package is published on the npm registry (checked December 2026 in the
 * registry list; the `npm search` endpoint is not reachable from this machine), hence own code.
 */
import type { OrderingOptions } from './ordering'

const flip = (i: number): number => -i - 2

/**
 * Approximate-minimum-degree permutation of a graph given as adjacency lists (no self loops,
 * symmetric): neighbours of v are `adj[ptr[v] .. ptr[v+1]-1]`. Returns `perm` with `perm[k]` =
 * the vertex eliminated k-th. Only `denseThreshold` of the options is used.
 */
export function approximateMinimumDegree(ptr: Int32Array, adj: Int32Array, options: OrderingOptions = {}): Int32Array {
  const n = ptr.length - 1
  if (n === 0) return new Int32Array(0)
  if (n === 1) return Int32Array.of(0)
  let dense = options.denseThreshold ?? Math.max(16, 10 * Math.sqrt(n))
  dense = Math.min(n - 2, dense)
  let cnz = ptr[n]!
  const nzmax = cnz + Math.floor(cnz / 5) + 2 * n
  const Ci = new Int32Array(nzmax)
  Ci.set(adj.subarray(0, cnz))
  const Cp = new Int32Array(n + 1)
  Cp.set(ptr.subarray(0, n + 1))
  const len = new Int32Array(n + 1), nv = new Int32Array(n + 1), next = new Int32Array(n + 1)
  const head = new Int32Array(n + 1), elen = new Int32Array(n + 1), degree = new Int32Array(n + 1)
  const w = new Int32Array(n + 1), hhead = new Int32Array(n + 1), last = new Int32Array(n + 1)
  for (let k = 0; k < n; k++) len[k] = Cp[k + 1]! - Cp[k]!
  len[n] = 0
  for (let i = 0; i <= n; i++) {
    head[i] = -1; last[i] = -1; next[i] = -1; hhead[i] = -1
    nv[i] = 1; w[i] = 1; elen[i] = 0; degree[i] = len[i]!
  }
  const LIMIT = 0x3fffffff
  const wclear = (mark: number, lemax: number): number => {
    if (mark < 2 || mark + lemax > LIMIT) {
      for (let k = 0; k < n; k++) if (w[k] !== 0) w[k] = 1
      mark = 2
    }
    return mark
  }
  let mark = wclear(0, 0)
  let nel = 0, mindeg = 0, lemax = 0
  elen[n] = -2; Cp[n] = -1; w[n] = 0 // n: the element collecting the dense rows
  for (let i = 0; i < n; i++) {
    const d = degree[i]!
    if (d === 0) {
      elen[i] = -2; nel++; Cp[i] = -1; w[i] = 0
    } else if (d > dense) {
      nv[i] = 0; elen[i] = -1; nel++; Cp[i] = flip(n); nv[n]!++
    } else {
      if (head[d] !== -1) last[head[d]!] = i
      next[i] = head[d]!
      head[d] = i
    }
  }
  while (nel < n) {
    // select a variable of minimum approximate degree
    let k = -1
    for (; mindeg < n && (k = head[mindeg]!) === -1; mindeg++);
    if (next[k] !== -1) last[next[k]!] = -1
    head[mindeg] = next[k]!
    const elenk = elen[k]!
    let nvk = nv[k]!
    nel += nvk
    // garbage collection of the quotient graph's storage
    if (elenk > 0 && cnz + mindeg >= nzmax) {
      for (let j = 0; j < n; j++) {
        const p = Cp[j]!
        if (p >= 0) { Cp[j] = Ci[p]!; Ci[p] = flip(j) }
      }
      let q = 0
      for (let p = 0; p < cnz;) {
        const j = flip(Ci[p++]!)
        if (j >= 0) {
          Ci[q] = Cp[j]!
          Cp[j] = q++
          for (let k3 = 0; k3 < len[j]! - 1; k3++) Ci[q++] = Ci[p++]!
        }
      }
      cnz = q
    }
    // construct the new element L_k
    let dk = 0
    nv[k] = -nvk
    let p = Cp[k]!
    const pk1 = elenk === 0 ? p : cnz
    let pk2 = pk1
    for (let k1 = 1; k1 <= elenk + 1; k1++) {
      let e: number, pj: number, ln: number
      if (k1 > elenk) { e = k; pj = p; ln = len[k]! - elenk } else { e = Ci[p++]!; pj = Cp[e]!; ln = len[e]! }
      for (let k2 = 1; k2 <= ln; k2++) {
        const i = Ci[pj++]!
        const nvi = nv[i]!
        if (nvi <= 0) continue
        dk += nvi
        nv[i] = -nvi
        Ci[pk2++] = i
        if (next[i] !== -1) last[next[i]!] = last[i]!
        if (last[i] !== -1) next[last[i]!] = next[i]!
        else head[degree[i]!] = next[i]!
      }
      if (e !== k) { Cp[e] = flip(k); w[e] = 0 }
    }
    if (elenk !== 0) cnz = pk2
    degree[k] = dk
    Cp[k] = pk1
    len[k] = pk2 - pk1
    elen[k] = -2
    // set differences |L_e \ L_k| for every element e adjacent to L_k
    mark = wclear(mark, lemax)
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk]!
      const eln = elen[i]!
      if (eln <= 0) continue
      const nvi = -nv[i]!
      const wnvi = mark - nvi
      for (let q = Cp[i]!; q <= Cp[i]! + eln - 1; q++) {
        const e = Ci[q]!
        if (w[e]! >= mark) w[e]! -= nvi
        else if (w[e] !== 0) w[e] = degree[e]! + wnvi
      }
    }
    // approximate degree update, aggressive absorption, pruning, mass elimination, hashing
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk]!
      const p1 = Cp[i]!
      const p2 = p1 + elen[i]! - 1
      let pn = p1
      let h = 0, d = 0
      for (let q = p1; q <= p2; q++) {
        const e = Ci[q]!
        if (w[e] !== 0) {
          const dext = w[e]! - mark
          if (dext > 0) { d += dext; Ci[pn++] = e; h += e } else { Cp[e] = flip(k); w[e] = 0 }
        }
      }
      elen[i] = pn - p1 + 1
      const p3 = pn
      const p4 = p1 + len[i]!
      for (let q = p2 + 1; q < p4; q++) {
        const j = Ci[q]!
        const nvj = nv[j]!
        if (nvj <= 0) continue
        d += nvj
        Ci[pn++] = j
        h += j
      }
      if (d === 0) {
        Cp[i] = flip(k)
        const nvi = -nv[i]!
        dk -= nvi; nvk += nvi; nel += nvi
        nv[i] = 0; elen[i] = -1
      } else {
        degree[i] = Math.min(degree[i]!, d)
        Ci[pn] = Ci[p3]!
        Ci[p3] = Ci[p1]!
        Ci[p1] = k
        len[i] = pn - p1 + 1
        h %= n
        next[i] = hhead[h]!
        hhead[h] = i
        last[i] = h
      }
    }
    degree[k] = dk
    lemax = Math.max(lemax, dk)
    mark = wclear(mark + lemax, lemax)
    // supervariable detection: variables with identical adjacency are merged
    for (let pk = pk1; pk < pk2; pk++) {
      let i = Ci[pk]!
      if (nv[i]! >= 0) continue
      const h = last[i]!
      i = hhead[h]!
      hhead[h] = -1
      for (; i !== -1 && next[i] !== -1; i = next[i]!, mark++) {
        const ln = len[i]!, eln = elen[i]!
        for (let q = Cp[i]! + 1; q <= Cp[i]! + ln - 1; q++) w[Ci[q]!] = mark
        let jlast = i
        for (let j = next[i]!; j !== -1;) {
          let ok = len[j] === ln && elen[j] === eln
          for (let q = Cp[j]! + 1; ok && q <= Cp[j]! + ln - 1; q++) if (w[Ci[q]!] !== mark) ok = false
          if (ok) {
            Cp[j] = flip(i)
            nv[i]! += nv[j]!
            nv[j] = 0; elen[j] = -1
            j = next[j]!
            next[jlast] = j
          } else {
            jlast = j
            j = next[j]!
          }
        }
      }
    }
    // finalise L_k: external degrees, back into the degree lists
    p = pk1
    for (let pk = pk1; pk < pk2; pk++) {
      const i = Ci[pk]!
      const nvi = -nv[i]!
      if (nvi <= 0) continue
      nv[i] = nvi
      let d = degree[i]! + dk - nvi
      d = Math.min(d, n - nel - nvi)
      if (head[d] !== -1) last[head[d]!] = i
      next[i] = head[d]!
      last[i] = -1
      head[d] = i
      mindeg = Math.min(mindeg, d)
      degree[i] = d
      Ci[p++] = i
    }
    nv[k] = nvk
    if ((len[k] = p - pk1) === 0) { Cp[k] = -1; w[k] = 0 }
    if (elenk !== 0) cnz = p
  }
  // postorder of the assembly tree (absorbed variables follow their representative)
  for (let i = 0; i < n; i++) Cp[i] = flip(Cp[i]!)
  for (let j = 0; j <= n; j++) head[j] = -1
  for (let j = n; j >= 0; j--) {
    if (nv[j]! > 0) continue
    next[j] = head[Cp[j]!]!
    head[Cp[j]!] = j
  }
  for (let e = n; e >= 0; e--) {
    if (nv[e]! <= 0) continue
    if (Cp[e] !== -1) { next[e] = head[Cp[e]!]!; head[Cp[e]!] = e }
  }
  const post = new Int32Array(n + 1)
  const stack = new Int32Array(n + 1)
  let k = 0
  for (let i = 0; i <= n; i++) {
    if (Cp[i] !== -1) continue
    let top = 0
    stack[0] = i
    while (top >= 0) {
      const v = stack[top]!
      const c = head[v]!
      if (c === -1) { top--; post[k++] = v } else { head[v] = next[c]!; stack[++top] = c }
    }
  }
  // post[n] is the dense-row element n itself
  return post.slice(0, n)
}
