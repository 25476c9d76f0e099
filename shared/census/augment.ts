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

/**
 * Kind of an edge for the invariant: 0 pendant, 1 loop, 2 other non-bridge; −1 when not
 * deletable. Bridges are only looked for when the map has neither pendant edges nor loops (they
 * would win anyway), which keeps the O(E²) test off most maps.
 */
function edgeKinds(vertexOf: Int32Array, degree: number[], nVertices: number): Int32Array {
  const E = vertexOf.length / 2
  const kind = new Int32Array(E)
  let easy = false
  for (let e = 0; e < E; e++) {
    const a = vertexOf[2 * e]!, b = vertexOf[2 * e + 1]!
    kind[e] = a === b ? 1 : (degree[a] === 1 || degree[b] === 1) ? 0 : 2
    if (kind[e]! < 2) easy = true
  }
  if (!easy) for (let e = 0; e < E; e++) if (isBridge(e, vertexOf, nVertices)) kind[e] = -1
  return kind
}

/** True when removing edge e disconnects the map's graph (BFS over vertices). */
function isBridge(e: number, vertexOf: Int32Array, nVertices: number): boolean {
  const E = vertexOf.length / 2
  const adj: number[][] = Array.from({ length: nVertices }, () => [])
  for (let f = 0; f < E; f++) {
    if (f === e) continue
    const a = vertexOf[2 * f]!, b = vertexOf[2 * f + 1]!
    adj[a]!.push(b); adj[b]!.push(a)
  }
  const seen = new Uint8Array(nVertices)
  const start = vertexOf[2 * e]!, goal = vertexOf[2 * e + 1]!
  const stack = [start]; seen[start] = 1
  while (stack.length) {
    const v = stack.pop()!
    if (v === goal) return false
    for (const w of adj[v]!) if (!seen[w]) { seen[w] = 1; stack.push(w) }
  }
  return true
}

/** Invariant of a deletable edge (smaller wins): kind, then the sorted end degrees. */
function edgeInvariant(e: number, kind: Int32Array, vertexOf: Int32Array, degree: number[]): number {
  const a = degree[vertexOf[2 * e]!]!, b = degree[vertexOf[2 * e + 1]!]!
  return kind[e]! * 1e6 + Math.min(a, b) * 1e3 + Math.max(a, b)
}

/**
 * Tests McKay's first condition for the child `sigma` whose last edge (darts n−2, n−1) was added:
 * the canonical code is taken over the roots on deletable edges of least invariant only (an
 * Aut-invariant set, see `canonicalize`), and the canonical deletable edge is the one holding the
 * root of that code. Returns the code (for merging siblings) and the optimal roots when accepted.
 */
export function acceptChild(sigma: Int32Array): { code: Int32Array, roots: number[] } | null {
  const n = sigma.length, E = n / 2
  const shape = mapShape(sigma)
  const vertexOf = shape.vertices.of
  const degree = shape.vertices.sizes
  const kind = edgeKinds(vertexOf, degree, shape.vertices.count)
  const inv = new Float64Array(E)
  let best = Infinity
  for (let e = 0; e < E; e++) {
    inv[e] = kind[e]! < 0 ? Infinity : edgeInvariant(e, kind, vertexOf, degree)
    if (inv[e]! < best) best = inv[e]!
  }
  const added = E - 1
  if (inv[added] !== best) return null
  const candidates: number[] = []
  for (let e = 0; e < E; e++) if (inv[e] === best) candidates.push(2 * e, 2 * e + 1)
  const canon = canonicalize(sigma, candidates)
  return canon.roots.some(r => r >> 1 === added) ? canon : null
}

/** Children of a map (all augmentations within the bounds), each as σ on n + 2 darts. */
function* augmentations(sigma: Int32Array, vertices: number, genus: number, faceOf: Int32Array, b: MapSearchBounds): Generator<{ sigma: Int32Array, vertices: number, genus: number }> {
  const n = sigma.length, x = n, y = n + 1
  if (vertices + 1 <= b.maxVertices) {
    for (let a = 0; a < n; a++) {
      const s = new Int32Array(n + 2); s.set(sigma)
      s[a] = x; s[x] = sigma[a]!; s[y] = y
      yield { sigma: s, vertices: vertices + 1, genus }
    }
  }
  for (let a = 0; a < n; a++) {
    for (let c = a; c < n; c++) {
      const g = faceOf[sigma[a]!] === faceOf[sigma[c]!] ? genus : genus + 1
      if (g > b.maxGenus) continue
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

function* grow(m: GeneratedMap, b: MapSearchBounds, prune?: (m: GeneratedMap) => boolean, admit?: ChildFilter): Generator<GeneratedMap> {
  yield m
  if (m.edges >= b.maxEdges || prune?.(m)) return
  const faceOf = mapShape(m.sigma).faces.of
  const seen = new Set<string>()
  const children: GeneratedMap[] = []
  for (const child of augmentations(m.sigma, m.vertices, m.genus, faceOf, b)) {
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
