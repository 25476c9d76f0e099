/**
 * Fill-reducing ordering by automatic nested dissection.
 *
 * Reference: A. George, J. W. H. Liu, "An automatic nested dissection algorithm for irregular
 * finite element problems", SIAM J. Numer. Anal. 15(5), 1978, 1090–1108; and A. George,
 * J. W. H. Liu, Computer Solution of Large Sparse Positive Definite Systems, 1981, ch. 8.
 *
 * For each connected piece of the graph of A + Aᵀ: find a pseudo-peripheral vertex (repeated
 * breadth-first search, §4.3 of the book), build its rooted level structure, take the level that
 * splits the vertex count in half as separator, keep only those separator vertices that touch
 * the next level (the book's refinement), number the separator LAST, and recurse on the pieces
 * left over. Pieces at or below `leafSize` vertices are numbered in reverse breadth-first order
 * (reverse Cuthill–McKee style), which keeps their small fill local.
 *
 * Numbers are handed out from n−1 downwards, so every separator is numbered after all vertices
 * of the piece it splits; independent pieces may interleave, which does not change the fill.
 */

/** Options of {@link nestedDissection}. */
export interface OrderingOptions {
  /** Pieces with at most this many vertices are not split further. Default 64. */
  leafSize?: number
  /**
   * Vertices with more than this many neighbours (e.g. the border row/column of a bordered
   * continuation matrix) are taken out of the graph and numbered last, as minimum-degree codes do
   * with dense rows (Amestoy, Davis, Duff, SIAM J. Matrix Anal. Appl. 17(4), 1996, §6).
   * Default max(16, 10·√n).
   */
  denseThreshold?: number
}

/**
 * Nested-dissection permutation of a graph given as adjacency lists (no self loops):
 * neighbours of v are `adj[ptr[v] .. ptr[v+1]-1]`. Returns `perm` with `perm[k]` = the vertex
 * eliminated k-th.
 */
export function nestedDissection(ptr: Int32Array, adj: Int32Array, options: OrderingOptions = {}): Int32Array {
  const n = ptr.length - 1
  const leafSize = options.leafSize ?? 64
  if (!(Number.isInteger(leafSize) && leafSize >= 1)) throw new Error('nestedDissection: leafSize must be an integer ≥ 1')
  const perm = new Int32Array(n)
  const alive = new Uint8Array(n).fill(1)
  const level = new Int32Array(n)
  const stamp = new Int32Array(n).fill(-1)
  const queue = new Int32Array(n)
  let currentStamp = 0
  let hi = n
  const dense = options.denseThreshold ?? Math.max(16, 10 * Math.sqrt(n))
  for (let v = n - 1; v >= 0; v--) {
    if (ptr[v + 1]! - ptr[v]! > dense) { alive[v] = 0; perm[--hi] = v }
  }

  /** BFS over alive vertices from `root`; fills queue[0..size) and level[]; returns [size, depth, levelEnds]. */
  const bfs = (root: number): { size: number; depth: number } => {
    const s = currentStamp++
    stamp[root] = s
    level[root] = 0
    queue[0] = root
    let head = 0, tail = 1
    while (head < tail) {
      const v = queue[head++]!
      for (let p = ptr[v]!; p < ptr[v + 1]!; p++) {
        const w = adj[p]!
        if (alive[w] && stamp[w] !== s) { stamp[w] = s; level[w] = level[v]! + 1; queue[tail++] = w }
      }
    }
    return { size: tail, depth: level[queue[tail - 1]!]! }
  }

  const aliveDegree = (v: number): number => {
    let d = 0
    for (let p = ptr[v]!; p < ptr[v + 1]!; p++) if (alive[adj[p]!]) d++
    return d
  }

  const stack: number[] = []
  for (let v = n - 1; v >= 0; v--) stack.push(v)
  while (stack.length > 0) {
    const start = stack.pop()!
    if (!alive[start]) continue
    // Pseudo-peripheral vertex (George & Liu 1981, §4.3.2).
    let root = start
    let { size, depth } = bfs(root)
    for (let iter = 0; iter < 8; iter++) {
      let best = -1, bestDeg = Infinity
      for (let k = size - 1; k >= 0 && level[queue[k]!] === depth; k--) {
        const d = aliveDegree(queue[k]!)
        if (d < bestDeg) { bestDeg = d; best = queue[k]! }
      }
      const trial = bfs(best)
      if (trial.depth > depth) { root = best; depth = trial.depth; size = trial.size } else { bfs(root); break }
    }
    if (size <= leafSize || depth < 2) {
      for (let k = 0; k < size; k++) { const v = queue[k]!; alive[v] = 0; perm[--hi] = v }
      continue
    }
    // Level containing the median vertex (levels are contiguous in queue order).
    const median = queue[size >> 1]!
    let sepLevel = level[median]!
    if (sepLevel === 0) sepLevel = 1
    if (sepLevel === depth) sepLevel = depth - 1
    const sep: number[] = []
    for (let k = 0; k < size; k++) {
      const v = queue[k]!
      if (level[v] !== sepLevel) continue
      let touchesNext = false
      for (let p = ptr[v]!; p < ptr[v + 1]! && !touchesNext; p++) {
        const w = adj[p]!
        if (alive[w] && level[w] === sepLevel + 1 && stamp[w] === stamp[v]) touchesNext = true
      }
      if (touchesNext) sep.push(v)
    }
    const rest: number[] = []
    for (let k = 0; k < size; k++) rest.push(queue[k]!)
    for (const v of sep) { alive[v] = 0; perm[--hi] = v }
    for (const v of rest) if (alive[v]) stack.push(v)
  }
  return perm
}

/** Identity permutation (no reordering). */
export function naturalOrdering(n: number): Int32Array {
  const p = new Int32Array(n)
  for (let i = 0; i < n; i++) p[i] = i
  return p
}

/** Inverse permutation: `inv[perm[k]] = k`. Throws if `perm` is not a permutation. */
export function invertPermutation(perm: Int32Array): Int32Array {
  const n = perm.length
  const inv = new Int32Array(n).fill(-1)
  for (let k = 0; k < n; k++) {
    const v = perm[k]!
    if (v < 0 || v >= n || inv[v] !== -1) throw new Error('invertPermutation: not a permutation')
    inv[v] = k
  }
  return inv
}

/** Sign (+1 or −1) of a permutation, from its cycle count. */
export function permutationSign(perm: Int32Array): 1 | -1 {
  const n = perm.length
  const seen = new Uint8Array(n)
  let cycles = 0
  for (let i = 0; i < n; i++) {
    if (seen[i]) continue
    cycles++
    for (let j = i; !seen[j]; j = perm[j]!) seen[j] = 1
  }
  return (n - cycles) % 2 === 0 ? 1 : -1
}
