/**
 * Combinatorics of the rotation system (docs/theory.md §2–3): faces as orbits of φ = σ∘ι (open wings
 * removed from σ first), connected components, Euler characteristic and genus, degree checks,
 * and the predicted topology of the glued surface.
 * Reference: B. Mohar, C. Thomassen, Graphs on Surfaces (2001), §3.2 (rotation systems, faces).
 */
import type { PatternModel } from './model'
import { degree } from './model'

/** Faces of the closed-edge rotation system. */
export interface Faces {
  count: number
  /** Face of each half-edge (−1 for wings). */
  faceOf: Int32Array
  /** Half-edges of each face in walking order. */
  cycles: number[][]
}

/** σ with the wings skipped, on closed half-edges (wings map to −1). */
export function closedSigma(m: PatternModel): Int32Array {
  const out = new Int32Array(m.nHalf).fill(-1)
  const closed = 2 * m.nEdges
  for (let h = 0; h < closed; h++) {
    let g = m.sigma[h]!
    while (g >= closed) g = m.sigma[g]!
    out[h] = g
  }
  return out
}

/** Faces: orbits of φ(h) = σ'(ι(h)) on closed half-edges. */
export function computeFaces(m: PatternModel): Faces {
  const sig = closedSigma(m)
  const faceOf = new Int32Array(m.nHalf).fill(-1)
  const cycles: number[][] = []
  for (let h0 = 0; h0 < 2 * m.nEdges; h0++) {
    if (faceOf[h0] !== -1) continue
    const cycle: number[] = []
    let h = h0
    do {
      faceOf[h] = cycles.length
      cycle.push(h)
      h = sig[m.iota[h]!]!
    } while (h !== h0)
    cycles.push(cycle)
  }
  return { count: cycles.length, faceOf, cycles }
}

/** Connected components of the graph (closed edges join vertices). */
export interface Components {
  count: number
  /** Component of each vertex. */
  of: Int32Array
}

/** Components by union–find over closed edges. */
export function computeComponents(m: PatternModel): Components {
  const parent = new Int32Array(m.nVertices).map((_, i) => i)
  const find = (x: number): number => {
    while (parent[x] !== x) { parent[x] = parent[parent[x]!]!; x = parent[x]! }
    return x
  }
  for (let e = 0; e < m.nEdges; e++) {
    const a = find(m.edgeFrom[e]!), b = find(m.edgeTo[e]!)
    if (a !== b) parent[a] = b
  }
  const label = new Map<number, number>()
  const of = new Int32Array(m.nVertices)
  for (let v = 0; v < m.nVertices; v++) {
    const r = find(v)
    if (!label.has(r)) label.set(r, label.size)
    of[v] = label.get(r)!
  }
  return { count: label.size, of }
}

/** Euler characteristic and genera. */
export interface Topology {
  vertices: number
  closedEdges: number
  openWings: number
  faces: number
  components: number
  /** χ = V − E + F of the rotation system (closed edges only). */
  eulerCharacteristic: number
  /** Genus of the rotation system's surface, (2c − χ)/2 summed over components. */
  embeddingGenus: number
  /** Genus of the glued surface's quotient, E − V + 1 (docs/theory.md §3); E − V + c summed over c components. */
  predictedGenus: number
  /** Number of open ends of the glued surface: one per open wing. */
  openEnds: number
}

/** Topology numbers from the model and its faces and components. */
export function computeTopology(m: PatternModel, faces: Faces, comps: Components): Topology {
  const chi = m.nVertices - m.nEdges + faces.count
  return {
    vertices: m.nVertices,
    closedEdges: m.nEdges,
    openWings: m.nWings,
    faces: faces.count,
    components: comps.count,
    eulerCharacteristic: chi,
    embeddingGenus: (2 * comps.count - chi) / 2,
    predictedGenus: m.nEdges - m.nVertices + comps.count,
    openEnds: m.nWings,
  }
}

/** Vertices whose degree is not even and ≥ 4 (a saddle tower has 2n ≥ 4 wings). */
export function badDegreeVertices(m: PatternModel): number[] {
  const bad: number[] = []
  for (let v = 0; v < m.nVertices; v++) {
    const d = degree(m, v)
    if (d < 4 || d % 2 !== 0) bad.push(v)
  }
  return bad
}
