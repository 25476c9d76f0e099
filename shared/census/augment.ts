/**
 * Isomorph-free generation of connected maps of genus ≤ g_max by canonical augmentation
 * (B. D. McKay, "Isomorph-free exhaustive generation", J. Algorithms 26, 1998, §3).
 *
 * Augmentation: add one edge to a map with E − 1 edges, either a chord between two corners
 * (same face: genus kept; two faces: genus + 1) or a pendant edge to a new vertex. Every connected
 * map with E ≥ 2 edges has a *deletable* edge (a loop, a non-bridge, or an edge to a vertex of
 * degree 1), and deleting it gives a connected map of no larger genus and no more vertices, so a
 * search bounded by genus and by vertices reaches every map. A child is accepted only if the added
 * edge lies in the automorphism orbit of the child's canonical deletable edge: among the
 * deletable edges of least invariant (kind, end degrees), the one holding the root of the least
 * code over their darts (map-code.ts). Accepted children of one parent that are isomorphic are
 * merged by their codes (McKay's second condition, checked on the parent's children only), so the
 * search is a tree with one node per isomorphism class and needs no global table.
 * Corner after dart d = the slot between d and σ(d); it lies in the face of σ(d).
 */
import { canonicalize, mapShape } from './map-code'

/** Bounds of the search. */
export interface MapSearchBounds {
  /** Edges at most (half-edges 2E). */
  maxEdges: number
  /** Vertices at most. */
  maxVertices: number
  /** Genus at most (0 or 1 here; any non-negative integer works). */
  maxGenus: number
  /**
   * Optional completion budget (half-edges): keep only maps that can still grow into a map of
   * genus exactly `maxGenus` with every vertex of even degree ≥ 4 and at most this many
   * half-edges (see `augmentations`). Unset: every map within the bounds.
   */
  completionHalfEdges?: number
}

/** A generated map: σ on 2E darts (ι(d) = d ^ 1), its shape and canonical data. */
export interface GeneratedMap {
  sigma: Int32Array
  vertices: number
  edges: number
  faces: number
  genus: number
  /** Canonical code over the roots on least-invariant deletable edges (not the census key: see enumerate.ts). */
  code: Int32Array
  /** |Aut| (orientation-preserving automorphisms). */
  automorphisms: number
}

/** Vertex of every dart and vertex degrees (σ orbits), in typed arrays. */
function vertexData(sigma: Int32Array): { of: Int32Array, degree: Int32Array, count: number } {
  const n = sigma.length
  const of = new Int32Array(n).fill(-1)
  const degree = new Int32Array(n + 1)
  let count = 0
  for (let d = 0; d < n; d++) {
    if (of[d]! >= 0) continue
    let x = d, size = 0
    while (of[x]! < 0) { of[x] = count; size++; x = sigma[x]! }
    degree[count++] = size
  }
  return { of, degree, count }
}

/** Face (φ = σ∘ι orbit) of every dart, and face sizes. */
function faceData(sigma: Int32Array): { of: Int32Array, size: Int32Array } {
  const n = sigma.length
  const of = new Int32Array(n).fill(-1), size = new Int32Array(n)
  let count = 0
  for (let d = 0; d < n; d++) {
    if (of[d]! >= 0) continue
    let x = d
    while (of[x]! < 0) { of[x] = count; size[count]!++; x = sigma[x ^ 1]! }
    count++
  }
  return { of, size }
}

/** True when removing edge e disconnects the map's graph (BFS over vertices, typed arrays). */
function isBridge(e: number, vertexOf: Int32Array, nVertices: number): boolean {
  const n = vertexOf.length
  // adjacency by darts: the darts at each vertex, excluding edge e
  const start = new Int32Array(nVertices + 1)
  for (let d = 0; d < n; d++) if (d >> 1 !== e) start[vertexOf[d]! + 1]!++
  for (let v = 0; v < nVertices; v++) start[v + 1]! += start[v]!
  const fill = start.slice(0, nVertices), darts = new Int32Array(n)
  for (let d = 0; d < n; d++) if (d >> 1 !== e) darts[fill[vertexOf[d]!]!++] = d
  const seen = new Uint8Array(nVertices), stack = new Int32Array(nVertices)
  const from = vertexOf[2 * e]!, goal = vertexOf[2 * e + 1]!
  let top = 0
  stack[top++] = from; seen[from] = 1
  while (top) {
    const v = stack[--top]!
    if (v === goal) return false
    for (let k = start[v]!; k < start[v + 1]!; k++) {
      const w = vertexOf[darts[k]! ^ 1]!
      if (!seen[w]) { seen[w] = 1; stack[top++] = w }
    }
  }
  return true
}

/**
 * Tests McKay's first condition for the child `sigma` whose last edge (darts n−2, n−1) was added.
 * Invariant of a deletable edge (smaller wins): kind (0 pendant, 1 loop, 2 other non-bridge;
 * bridges are not deletable), then the sorted end degrees. The canonical code is taken over the
 * roots on deletable edges of least invariant only (an Aut-invariant set, see `canonicalize`), and
 * the canonical deletable edge is the one holding the root of that code. Returns the code (for
 * merging siblings) and the optimal roots when accepted.
 * Early exits (same verdict, less work): the added edge is never a bridge (a chord joins a
 * connected map; a pendant edge is deletable), so the child is rejected as soon as one deletable
 * edge beats its invariant, and bridges are only tested on kind-2 edges whose degrees tie or beat
 * the added edge's.
 */
export function acceptChild(sigma: Int32Array): { code: Int32Array, roots: number[] } | null {
  const n = sigma.length, E = n / 2, added = E - 1
  const { of: vertexOf, degree, count } = vertexData(sigma)
  const inv = new Float64Array(E)
  let hard = false
  for (let e = 0; e < E; e++) {
    const a = vertexOf[2 * e]!, b = vertexOf[2 * e + 1]!
    const da = degree[a]!, db = degree[b]!
    const kind = a === b ? 1 : (da === 1 || db === 1) ? 0 : 2
    if (kind === 2) hard = true
    inv[e] = kind * 1e6 + Math.min(da, db) * 1e3 + Math.max(da, db)
  }
  const mine = inv[added]!
  for (let e = 0; e < E; e++) if (inv[e]! < 2e6 && inv[e]! < mine) return null
  if (hard) {
    for (let e = 0; e < E; e++) {
      if (e === added || inv[e]! < 2e6 || inv[e]! > mine) continue
      if (isBridge(e, vertexOf, count)) inv[e] = Infinity
      else if (inv[e]! < mine) return null
    }
  }
  const candidates: number[] = []
  for (let e = 0; e < E; e++) if (inv[e] === mine) candidates.push(2 * e, 2 * e + 1)
  const canon = canonicalize(sigma, candidates)
  return canon.roots.some(r => r >> 1 === added) ? canon : null
}

/**
 * Half-edges still to be added at a vertex of degree d with m faces of one half-edge at its
 * corners: at least one dart per such corner, at least 4 − d, and the final degree even.
 */
function vertexNeed(d: number, m: number): number {
  let k = Math.max(4 - d, m, 0)
  if ((d + k) & 1) k++
  return k
}

/**
 * Children of a map (all augmentations within the bounds), each as σ on n + 2 darts.
 * Genus never drops along the tree: a chord inside one face keeps χ (F + 1), a chord between two
 * faces lowers it by 2 (F − 1), a pendant edge keeps it (V + 1); so a child above `maxGenus` is
 * never built.
 * With `b.completionHalfEdges` set, a child is only built when it can still become a map of genus
 * `maxGenus`, every vertex of even degree ≥ 4 and every face of ≥ 2 half-edges within that many
 * half-edges. Every descendant of the child contains it (edges are only added), so a lower bound
 * on the half-edges any completion must add, above the half-edges left, proves the subtree empty.
 * Two lower bounds:
 * - per vertex v, `vertexNeed(d_v, m_v)`: a face of one half-edge {h} (σ(ιh) = h, a loop's inside)
 *   stays one until a dart is put into its only corner, which lies at v; distinct such faces have
 *   distinct corners; the degree must reach an even number ≥ 4. Summed over the vertices (new
 *   vertices only add);
 * - genus: 2 (maxGenus − g) (only a chord between two faces raises it, by one).
 * The child's counts follow from the parent's in O(1), changing only at the ends of the new edge:
 * a pendant edge at the corner after a grows the face of σ(a) by two; a chord a–c inside one face
 * splits it into two faces of ≥ 2 half-edges when a ≠ c, and when a = c (a loop) into the old
 * face plus one and a new face of one half-edge (the loop's inside, at a's vertex); a chord
 * between two faces merges them into one of ≥ 4. The face of σ(a) has its corner at a's vertex.
 */
function* augmentations(sigma: Int32Array, vertices: number, genus: number, faces: { of: Int32Array, size: Int32Array }, b: MapSearchBounds): Generator<{ sigma: Int32Array, vertices: number, genus: number }> {
  const n = sigma.length, x = n, y = n + 1
  const faceOf = faces.of, faceSize = faces.size
  const budget = b.completionHalfEdges
  const left = budget === undefined ? 0 : budget - n - 2
  let vertexOf: Int32Array = new Int32Array(0), degree: Int32Array = vertexOf, monoAt: Int32Array = vertexOf, need = 0
  if (budget !== undefined) {
    ({ of: vertexOf, degree } = vertexData(sigma))
    monoAt = new Int32Array(vertices)
    for (let d = 0; d < n; d++) if (faceSize[faceOf[d]!] === 1) monoAt[vertexOf[d]!]!++
    for (let v = 0; v < vertices; v++) need += vertexNeed(degree[v]!, monoAt[v]!)
  }
  const isMono = (f: number) => (faceSize[f] === 1 ? 1 : 0)
  if (vertices + 1 <= b.maxVertices) {
    const genusNeed = 2 * (b.maxGenus - genus)
    for (let a = 0; a < n; a++) {
      if (budget !== undefined) {
        const v = vertexOf[a]!, d = degree[v]!, m = monoAt[v]!
        const nc = need - vertexNeed(d, m) + vertexNeed(d + 1, m - isMono(faceOf[sigma[a]!]!)) + vertexNeed(1, 0)
        if (nc > left || genusNeed > left) continue
      }
      const s = new Int32Array(n + 2); s.set(sigma)
      s[a] = x; s[x] = sigma[a]!; s[y] = y
      yield { sigma: s, vertices: vertices + 1, genus }
    }
  }
  for (let a = 0; a < n; a++) {
    const fa = faceOf[sigma[a]!]!
    for (let c = a; c < n; c++) {
      const fc = faceOf[sigma[c]!]!
      const g = fa === fc ? genus : genus + 1
      if (g > b.maxGenus) continue
      if (budget !== undefined) {
        if (2 * (b.maxGenus - g) > left) continue
        const va = vertexOf[a]!, vc = vertexOf[c]!
        const da = degree[va]!, dc = degree[vc]!, ma = monoAt[va]!, mc = monoAt[vc]!
        let nc: number
        if (fa !== fc) {
          nc = va === vc
            ? need - vertexNeed(da, ma) + vertexNeed(da + 2, ma - isMono(fa) - isMono(fc))
            : need - vertexNeed(da, ma) - vertexNeed(dc, mc) + vertexNeed(da + 1, ma - isMono(fa)) + vertexNeed(dc + 1, mc - isMono(fc))
        } else if (a === c) {
          nc = need - vertexNeed(da, ma) + vertexNeed(da + 2, ma - isMono(fa) + 1)
        } else {
          nc = va === vc
            ? need - vertexNeed(da, ma) + vertexNeed(da + 2, ma)
            : need - vertexNeed(da, ma) - vertexNeed(dc, mc) + vertexNeed(da + 1, ma) + vertexNeed(dc + 1, mc)
        }
        if (nc > left) continue
      }
      const s = new Int32Array(n + 2); s.set(sigma)
      if (a === c) { s[a] = x; s[x] = y; s[y] = sigma[a]! } else {
        s[a] = x; s[x] = sigma[a]!; s[c] = y; s[y] = sigma[c]!
      }
      yield { sigma: s, vertices, genus: g }
    }
  }
}

/** Resolves bounds; throws on nonsense. */
export function checkBounds(b: MapSearchBounds): MapSearchBounds {
  for (const k of ['maxEdges', 'maxVertices', 'maxGenus'] as const) {
    if (!(Number.isInteger(b[k]) && b[k] >= 0)) throw new Error(`${k} must be a non-negative integer`)
  }
  return b
}

/**
 * Every connected map with 1 ≤ E ≤ maxEdges, V ≤ maxVertices and genus ≤ maxGenus, each exactly
 * once up to orientation-preserving isomorphism, depth first (parents before children).
 * `prune(map)` returning true skips the map's descendants (the map itself is still yielded).
 */
export function* generateMaps(bounds: MapSearchBounds, prune?: (m: GeneratedMap) => boolean, admit?: ChildFilter): Generator<GeneratedMap> {
  const b = checkBounds(bounds)
  if (b.maxEdges < 1 || b.maxVertices < 1) return
  const seeds: Int32Array[] = [Int32Array.from([1, 0])]
  if (b.maxVertices >= 2) seeds.push(Int32Array.from([0, 1]))
  for (const s of seeds) {
    const c = canonicalize(s)
    yield* grow({ sigma: s, ...shapeOf(s), code: c.code, automorphisms: c.roots.length }, b, prune, admit)
  }
}

function shapeOf(sigma: Int32Array) {
  const sh = mapShape(sigma)
  return { vertices: sh.vertices.count, edges: sigma.length / 2, faces: sh.faces.count, genus: sh.genus }
}

/**
 * A child filter: false drops the child and so its whole subtree. It must be monotone (false
 * for a map ⇒ false for every map obtained from it by adding edges), or maps are lost.
 */
export type ChildFilter = (sigma: Int32Array, vertices: number, genus: number) => boolean

/**
 * The subtree of the search below `m` (m first, then its descendants depth first): the search
 * tree's nodes are independent, so subtrees can be searched apart (in threads) and their maps
 * are still pairwise non-isomorphic.
 */
export function* growFrom(m: GeneratedMap, bounds: MapSearchBounds, prune?: (m: GeneratedMap) => boolean, admit?: ChildFilter): Generator<GeneratedMap> {
  yield* grow(m, checkBounds(bounds), prune, admit)
}

function* grow(m: GeneratedMap, b: MapSearchBounds, prune?: (m: GeneratedMap) => boolean, admit?: ChildFilter): Generator<GeneratedMap> {
  yield m
  if (m.edges >= b.maxEdges || prune?.(m)) return
  const faces = faceData(m.sigma)
  const seen = new Set<string>()
  const children: GeneratedMap[] = []
  for (const child of augmentations(m.sigma, m.vertices, m.genus, faces, b)) {
    if (admit && !admit(child.sigma, child.vertices, child.genus)) continue
    const acc = acceptChild(child.sigma)
    if (!acc) continue
    const key = acc.code.join('.')
    if (seen.has(key)) continue
    seen.add(key)
    const faces = child.sigma.length / 2 - child.vertices + 2 - 2 * child.genus
    children.push({ sigma: child.sigma, vertices: child.vertices, edges: m.edges + 1, faces, genus: child.genus, code: acc.code, automorphisms: acc.roots.length })
  }
  for (const c of children) yield* grow(c, b, prune, admit)
}
