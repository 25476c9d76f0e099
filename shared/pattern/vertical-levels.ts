/**
 * The level structure of vertical balance on cuts (H. Chen, M. Traizet, "Gluing Karcher–Scherk
 * saddle towers I", arXiv 2103.15676, 2021, Def. 6.2; H. Chen, "Gluing Karcher–Scherk saddle
 * towers II", Comm. Anal. Geom. 32, 2024, Def. 2). A cut b of a non-empty proper vertex set X
 * is balanced when F_b = Σ K_h sin φ_h over the cut's SHORTEST half-edges vanishes. All 2^V − 2
 * cut equations are equivalent to the level rows built here (our derivation, docs/conditions.md):
 * with t_1 < … < t_r the distinct closed-edge lengths and G_{<t} the graph of the edges shorter
 * than t, one row F_{X,t} = Σ_{h leaving X, ℓ_h = t} K_h sin φ_h per component X of G_{<t}.
 * Edges are taken in increasing length (Kruskal order) with union–find; the rows of the parts
 * merged into one component of G_{≤t} sum to zero, so the part holding the smallest vertex is
 * dropped: c(G_{<t}) − c(G_{≤t}) rows per level, V − c in all (rank V − 1 for a connected graph,
 * CT-I Prop. 3.8). Loops never leave a vertex set and open wings are not in any cut.
 * Equal lengths: |ℓ_e − ℓ_f| ≤ tol·max(ℓ_e, ℓ_f) along the sorted chain (tol 1e-9); the
 * structure is rebuilt at 1e-6 and a difference is reported as "near a wall".
 */

/** One term of a level row: sign·K_e·sin φ_e (sign +1 when the edge leaves X at its `from` end). */
export interface LevelTerm { edge: number; sign: 1 | -1 }

/** One equation F_{X,t} = 0. */
export interface LevelRow {
  /** Index into `levels`. */
  level: number
  /** The vertex set X (a component of G_{<t}), ascending. */
  vertices: number[]
  /** The level-t edges leaving X. */
  terms: LevelTerm[]
}

/** One length level t: the non-loop closed edges of that length. */
export interface Level {
  /** Mean length of the level's edges. */
  length: number
  edges: number[]
  /** (max − min)/max over the level's lengths: above 1e-8 the tie is a chain of small gaps. */
  spread: number
}

/** The level structure of a drawing. */
export interface LevelStructure {
  tolerance: number
  levels: Level[]
  /** The V − c independent rows, level by level, by smallest vertex within a level. */
  rows: LevelRow[]
  /** Components c of the graph (closed non-loop edges). */
  components: number
  /** Smallest vertex of each component (the pinned phase of each component). */
  pinned: number[]
  /** All (X, edges) parts, dropped ones included, as comparable keys (for the wall test). */
  partKeys: string[]
  /** Every non-loop edge in one level: the rows are the vertex sums (the earlier rule is exact). */
  singleLevel: boolean
}

/** Default equal-length tolerance (relative). */
export const LEVEL_TOLERANCE = 1e-9
/** Tolerance of the recheck whose difference means "near a wall". */
export const NEAR_WALL_TOLERANCE = 1e-6
/** A level spreading over more than this (relative) is a chained tie. */
export const CHAINED_TIE_SPREAD = 1e-8

/** Union–find with member lists (smaller list merged into larger). */
class Parts {
  parent: Int32Array
  members: number[][]
  constructor(n: number) {
    this.parent = Int32Array.from({ length: n }, (_, i) => i)
    this.members = Array.from({ length: n }, (_, i) => [i])
  }

  find(x: number): number {
    const p = this.parent
    while (p[x] !== x) { p[x] = p[p[x]!]!; x = p[x]! }
    return x
  }

  union(a: number, b: number): void {
    a = this.find(a); b = this.find(b)
    if (a === b) return
    if (this.members[a]!.length < this.members[b]!.length) [a, b] = [b, a]
    this.parent[b] = a
    for (const v of this.members[b]!) this.members[a]!.push(v)
    this.members[b] = []
  }
}

/** Minimal view of a model the structure needs (lets tests build graphs directly). */
export interface LevelGraph { nVertices: number; nEdges: number; edgeFrom: ArrayLike<number>; edgeTo: ArrayLike<number> }

/** Groups the non-loop edges into levels by the sorted chain with relative tolerance `tol`. */
export function lengthLevels(g: LevelGraph, lengths: ArrayLike<number>, tol = LEVEL_TOLERANCE): Level[] {
  const order: number[] = []
  for (let e = 0; e < g.nEdges; e++) if (g.edgeFrom[e] !== g.edgeTo[e]) order.push(e)
  order.sort((a, b) => lengths[a]! - lengths[b]! || a - b)
  const levels: Level[] = []
  let cur: number[] = []
  const close = () => {
    if (!cur.length) return
    const ls = cur.map(e => lengths[e]!)
    const lo = Math.min(...ls), hi = Math.max(...ls)
    levels.push({ length: ls.reduce((s, l) => s + l, 0) / ls.length, edges: cur, spread: hi > 0 ? (hi - lo) / hi : 0 })
    cur = []
  }
  for (let i = 0; i < order.length; i++) {
    const e = order[i]!
    if (cur.length) {
      const prev = lengths[cur[cur.length - 1]!]!, l = lengths[e]!
      if (Math.abs(l - prev) > tol * Math.max(l, prev)) close()
    }
    cur.push(e)
  }
  close()
  return levels
}

/** Builds the level rows of a graph with the given closed-edge lengths. */
export function levelStructure(g: LevelGraph, lengths: ArrayLike<number>, tol = LEVEL_TOLERANCE): LevelStructure {
  const levels = lengthLevels(g, lengths, tol)
  const uf = new Parts(g.nVertices)
  const rows: LevelRow[] = []
  const partKeys: string[] = []
  levels.forEach((lev, li) => {
    // parts of G_{<t} touched by the level, with the level edges leaving each
    const touched = new Map<number, LevelTerm[]>()
    for (const e of lev.edges) {
      const a = uf.find(g.edgeFrom[e]!), b = uf.find(g.edgeTo[e]!)
      if (a === b) continue
      if (!touched.has(a)) touched.set(a, [])
      if (!touched.has(b)) touched.set(b, [])
      touched.get(a)!.push({ edge: e, sign: 1 })
      touched.get(b)!.push({ edge: e, sign: -1 })
    }
    const parts = [...touched.entries()].map(([root, terms]) => ({
      root, terms, vertices: [...uf.members[root]!].sort((x, y) => x - y),
    }))
    for (const e of lev.edges) uf.union(g.edgeFrom[e]!, g.edgeTo[e]!)
    // group the parts by their component of G_{≤t}; drop the part holding the smallest vertex
    const byNew = new Map<number, typeof parts>()
    for (const p of parts) {
      const r = uf.find(p.root)
      if (!byNew.has(r)) byNew.set(r, [])
      byNew.get(r)!.push(p)
    }
    const kept: LevelRow[] = []
    for (const group of byNew.values()) {
      group.sort((x, y) => x.vertices[0]! - y.vertices[0]!)
      group.forEach((p, i) => {
        partKeys.push(`${p.vertices.join(',')}|${p.terms.map(t => t.edge).sort((x, y) => x - y).join(',')}`)
        if (i > 0) kept.push({ level: li, vertices: p.vertices, terms: p.terms })
      })
    }
    kept.sort((x, y) => x.vertices[0]! - y.vertices[0]!)
    rows.push(...kept)
  })
  const pinned: number[] = []
  for (let v = 0; v < g.nVertices; v++) if (uf.find(v) === v) pinned.push(Math.min(...uf.members[v]!))
  pinned.sort((a, b) => a - b)
  return {
    tolerance: tol, levels, rows, components: pinned.length, pinned, partKeys: partKeys.sort(),
    singleLevel: levels.length <= 1,
  }
}

/** Two edges whose lengths are tied at the recheck tolerance but not at the verdict tolerance. */
export interface WallPair { edges: [number, number]; relativeGap: number }

/** What the 1e-6 recheck found. */
export interface WallReport {
  /** The (component, edges) pairs differ between the 1e-9 and 1e-6 structures. */
  nearWall: boolean
  pairs: WallPair[]
  /** Levels (indices) whose spread exceeds 1e-8: chains of small gaps. */
  chainedTies: number[]
}

/** Rebuilds the structure at `near` and names the edge pairs that make the difference. */
export function wallReport(g: LevelGraph, lengths: ArrayLike<number>, s: LevelStructure, near = NEAR_WALL_TOLERANCE): WallReport {
  const t = levelStructure(g, lengths, near)
  const same = t.partKeys.length === s.partKeys.length && t.partKeys.every((k, i) => k === s.partKeys[i])
  const pairs: WallPair[] = []
  if (!same) {
    const order: number[] = []
    for (let e = 0; e < g.nEdges; e++) if (g.edgeFrom[e] !== g.edgeTo[e]) order.push(e)
    order.sort((a, b) => lengths[a]! - lengths[b]! || a - b)
    for (let i = 1; i < order.length; i++) {
      const a = order[i - 1]!, b = order[i]!
      const la = lengths[a]!, lb = lengths[b]!
      const gap = Math.abs(lb - la) / Math.max(la, lb)
      if (gap > s.tolerance && gap <= near) pairs.push({ edges: [a, b], relativeGap: gap })
    }
  }
  const chainedTies = s.levels.flatMap((l, i) => (l.spread > CHAINED_TIE_SPREAD ? [i] : []))
  return { nearWall: !same, pairs, chainedTies }
}
