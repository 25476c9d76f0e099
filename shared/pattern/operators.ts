/**
 * Linear operators on the edge space A (one value per closed edge, a(ιh) = −a(h)), docs/theory.md §2:
 *   div: A → R^V,  (div a)(v) = Σ_{h at v} a(h)
 *   curl: A → R^F, (curl a)(f) = Σ_{h in f} a(h)
 *   d: R^V → A,    (d g)(e) = g(to) − g(from) = (−divᵀ g)(e)
 * and bases of the cut space (im d, dimension V − c) and the cycle space (ker div, dimension
 * E − V + c): R. Diestel, Graph Theory (5th ed., 2017), §1.9.
 * Column e uses the edge's reference half-edge 2e (its `from` end).
 */
import { TripletBuilder, type Triplets } from '../linalg/triplets'
import type { Faces } from './combinatorics'
import type { PatternModel } from './model'

/** div as a V × E sparse matrix. Loops give 0 (both ends cancel). */
export function divMatrix(m: PatternModel): Triplets {
  const b = new TripletBuilder(m.nVertices, m.nEdges, 2 * m.nEdges)
  for (let e = 0; e < m.nEdges; e++) {
    b.add(m.edgeFrom[e]!, e, 1)
    b.add(m.edgeTo[e]!, e, -1)
  }
  return b.build()
}

/** Gradient d = −divᵀ as an E × V sparse matrix. */
export function gradientMatrix(m: PatternModel): Triplets {
  const b = new TripletBuilder(m.nEdges, m.nVertices, 2 * m.nEdges)
  for (let e = 0; e < m.nEdges; e++) {
    b.add(e, m.edgeTo[e]!, 1)
    b.add(e, m.edgeFrom[e]!, -1)
  }
  return b.build()
}

/** curl as an F × E sparse matrix: +1 when the face walks 2e, −1 when it walks 2e+1. */
export function curlMatrix(m: PatternModel, faces: Faces): Triplets {
  const b = new TripletBuilder(faces.count, m.nEdges, 2 * m.nEdges)
  for (let h = 0; h < 2 * m.nEdges; h++) b.add(faces.faceOf[h]!, h >> 1, h % 2 === 0 ? 1 : -1)
  return b.build()
}

/** A spanning forest by breadth-first search: tree edges and, per vertex, its parent edge. */
export interface SpanningForest {
  inTree: Uint8Array
  parentEdge: Int32Array
  parentVertex: Int32Array
  depth: Int32Array
  roots: number[]
}

/** Breadth-first spanning forest over closed edges. */
export function spanningForest(m: PatternModel): SpanningForest {
  const V = m.nVertices
  const f: SpanningForest = {
    inTree: new Uint8Array(m.nEdges),
    parentEdge: new Int32Array(V).fill(-1),
    parentVertex: new Int32Array(V).fill(-1),
    depth: new Int32Array(V).fill(-1),
    roots: [],
  }
  for (let r = 0; r < V; r++) {
    if (f.depth[r] !== -1) continue
    f.roots.push(r)
    f.depth[r] = 0
    const queue = [r]
    for (let qi = 0; qi < queue.length; qi++) {
      const v = queue[qi]!
      for (let i = m.starStart[v]!; i < m.starStart[v + 1]!; i++) {
        const h = m.starHalf[i]!
        if (h >= 2 * m.nEdges) continue
        const w = m.vertexOf[m.iota[h]!]!
        if (f.depth[w] !== -1) continue
        f.depth[w] = f.depth[v]! + 1
        f.parentEdge[w] = h >> 1
        f.parentVertex[w] = v
        f.inTree[h >> 1] = 1
        queue.push(w)
      }
    }
  }
  return f
}

/** Cut space basis: d(δ_v) for every vertex except each component's root (V − c vectors). */
export function cutSpaceBasis(m: PatternModel, forest: SpanningForest): number[][] {
  const roots = new Set(forest.roots)
  const basis: number[][] = []
  for (let v = 0; v < m.nVertices; v++) {
    if (roots.has(v)) continue
    const row = new Array<number>(m.nEdges).fill(0)
    for (let e = 0; e < m.nEdges; e++) {
      if (m.edgeTo[e] === v) row[e]! += 1
      if (m.edgeFrom[e] === v) row[e]! -= 1
    }
    basis.push(row)
  }
  return basis
}

/**
 * Signed tree path from u to the root as edge coefficients (+1 when walked from→to).
 * Adds `sign` times the path into `row`.
 */
function addRootPath(m: PatternModel, f: SpanningForest, u: number, sign: number, row: number[]): void {
  while (f.parentEdge[u] !== -1) {
    const e = f.parentEdge[u]!
    // walking from u up to its parent: +1 if the edge goes u → parent
    row[e]! += sign * (m.edgeFrom[e] === u ? 1 : -1)
    u = f.parentVertex[u]!
  }
}

/**
 * Cycle space basis: one fundamental cycle per non-tree edge (E − V + c vectors). The cycle of
 * non-tree edge e walks e from `from` to `to`, then the tree back: coefficients in {−1, 0, 1}.
 */
export function cycleSpaceBasis(m: PatternModel, forest: SpanningForest): number[][] {
  const basis: number[][] = []
  for (let e = 0; e < m.nEdges; e++) {
    if (forest.inTree[e]) continue
    const row = new Array<number>(m.nEdges).fill(0)
    row[e] = 1
    addRootPath(m, forest, m.edgeTo[e]!, 1, row) // to → root
    addRootPath(m, forest, m.edgeFrom[e]!, -1, row) // root → from
    basis.push(row)
  }
  return basis
}
