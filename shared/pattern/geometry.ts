/**
 * Geometry of a drawing (docs/theory.md §3): edge vectors x_e = p(to) + T(k_e) − p(from), lengths,
 * total length, and the signed cyclic-order margin of each vertex.
 */
import type { Lattice, PatternModel } from './model'
import { halfEdgeDirection } from './model'
import { minOf } from '../linalg/vectors'

/** Edge vectors of the closed edges (2E, interleaved), into `out` (allocated when absent). */
export function edgeVectors(
  m: PatternModel, p: Float64Array, lat: Lattice, out = new Float64Array(2 * m.nEdges),
): Float64Array {
  const { w1, w2 } = lat
  for (let e = 0; e < m.nEdges; e++) {
    const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
    const k1 = m.shift[4 * e]!, k2 = m.shift[4 * e + 1]!
    out[2 * e] = p[2 * w]! - p[2 * v]! + k1 * w1[0] + k2 * w2[0]
    out[2 * e + 1] = p[2 * w + 1]! - p[2 * v + 1]! + k1 * w1[1] + k2 * w2[1]
  }
  return out
}

/** Lengths ℓ_e of the closed edges (E). */
export function edgeLengths(
  m: PatternModel, p: Float64Array, lat: Lattice, out = new Float64Array(m.nEdges),
): Float64Array {
  const x = edgeVectors(m, p, lat)
  for (let e = 0; e < m.nEdges; e++) out[e] = Math.hypot(x[2 * e]!, x[2 * e + 1]!)
  return out
}

/** Shortest closed edge length (Infinity without closed edges): reaching 0 is a collapse. */
export function minEdgeLength(m: PatternModel, p: Float64Array, lat: Lattice): number {
  return minOf(edgeLengths(m, p, lat))
}

/** Mean closed edge length (1 without closed edges): the length scale of the drawing. */
export function meanEdgeLength(m: PatternModel, p: Float64Array, lat: Lattice): number {
  if (m.nEdges === 0) return 1
  return edgeLengths(m, p, lat).reduce((s, l) => s + l, 0) / m.nEdges
}

/** Total length Σ_closed ℓ_e (the open-wing term of L is left out: it depends on the origin). */
export function totalLength(m: PatternModel, p: Float64Array, lat: Lattice): number {
  return edgeLengths(m, p, lat).reduce((s, l) => s + l, 0)
}

/**
 * The length functional L(p) = Σ_closed ℓ_e − Σ_open ⟨u_h, p(v(h))⟩ (docs/theory.md §4), whose
 * gradient is −B: balanced drawings are its critical points (here: minima, L being convex).
 */
export function lengthFunctional(m: PatternModel, p: Float64Array, lat: Lattice): number {
  let l = totalLength(m, p, lat)
  for (let j = 0; j < m.nWings; j++) {
    const v = m.vertexOf[2 * m.nEdges + j]!
    l -= m.wingDir[2 * j]! * p[2 * v]! + m.wingDir[2 * j + 1]! * p[2 * v + 1]!
  }
  return l
}

const TWO_PI = 2 * Math.PI

/**
 * Signed cyclic-order margin per vertex (V values, radians). With θ_j ∈ [0, 2π) the
 * counter-clockwise angle from the j-th half-edge of the σ order to the next, the drawn order
 * agrees with σ iff Σ θ_j = 2π; the margin is then min θ_j (≥ 0; 0 when two directions
 * coincide). When the order disagrees, the margin is −min_j (2π − θ_j), so it passes through 0
 * continuously when two neighbours in σ swap (an order flip). Vertices of degree ≤ 1: +π.
 * Parallel directions (|θ| ≤ `parallelTol`) count as θ = 0, which σ allows.
 */
export function orderMargins(
  m: PatternModel, p: Float64Array, lat: Lattice, parallelTol = 1e-12,
  out = new Float64Array(m.nVertices),
): Float64Array {
  const d = new Float64Array(2)
  for (let v = 0; v < m.nVertices; v++) {
    const s = m.starStart[v]!, n = m.starStart[v + 1]! - s
    if (n <= 1) { out[v] = Math.PI; continue }
    const angles = new Float64Array(n)
    for (let j = 0; j < n; j++) {
      halfEdgeDirection(m, p, lat, m.starHalf[s + j]!, d)
      angles[j] = Math.atan2(d[1]!, d[0]!)
    }
    let sum = 0, minGap = Infinity, minCo = Infinity
    for (let j = 0; j < n; j++) {
      let gap = angles[(j + 1) % n]! - angles[j]!
      gap = ((gap % TWO_PI) + TWO_PI) % TWO_PI
      if (gap > TWO_PI - parallelTol) gap = 0
      sum += gap
      minGap = Math.min(minGap, gap)
      minCo = Math.min(minCo, TWO_PI - gap)
    }
    const agrees = Math.abs(sum - TWO_PI) < 1e-9 || sum < 1e-9
    out[v] = agrees ? minGap : -minCo
  }
  return out
}
