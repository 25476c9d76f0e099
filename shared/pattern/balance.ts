/**
 * Horizontal balance (docs/theory.md §4): residual B(v) = Σ_{h at v} u_h, its analytic Jacobian
 * J = ∂B/∂p (symmetric, = −Hess L) and its lattice derivative ∂B/∂(ω1x, ω1y, ω2x, ω2y).
 * A closed edge e: v → w with x_e = p_w + T(k_e) − p_v, ℓ = |x_e|, u = x_e/ℓ, P = I − u uᵀ:
 *   B(v) += u, B(w) −= u;  ∂u/∂x = P/ℓ;  ∂x/∂p_w = I, ∂x/∂p_v = −I, ∂x/∂ω_i = k_i I.
 * Open wings add their fixed unit direction to B of their vertex. Loops cancel exactly.
 */
import { TripletBuilder, type Triplets } from '../linalg/triplets'
import type { Lattice, PatternModel } from './model'
import { edgeVectors } from './geometry'

/** B (2V, interleaved) into `out`; returns `out`. */
export function balanceResidual(
  m: PatternModel, p: Float64Array, lat: Lattice, out = new Float64Array(2 * m.nVertices),
): Float64Array {
  out.fill(0)
  forEachEdgeUnit(m, p, lat, (_e, v, w, ux, uy) => {
    out[2 * v]! += ux; out[2 * v + 1]! += uy
    out[2 * w]! -= ux; out[2 * w + 1]! -= uy
  })
  for (let j = 0; j < m.nWings; j++) {
    const v = m.vertexOf[2 * m.nEdges + j]!
    out[2 * v]! += m.wingDir[2 * j]!
    out[2 * v + 1]! += m.wingDir[2 * j + 1]!
  }
  return out
}

/** Calls fn(e, v, w, u_x, u_y, ℓ) for each non-loop closed edge (loops cancel in B). */
function forEachEdgeUnit(
  m: PatternModel, p: Float64Array, lat: Lattice,
  fn: (e: number, v: number, w: number, ux: number, uy: number, l: number) => void,
): void {
  const x = edgeVectors(m, p, lat)
  for (let e = 0; e < m.nEdges; e++) {
    const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
    if (v === w) continue
    const l = Math.hypot(x[2 * e]!, x[2 * e + 1]!)
    fn(e, v, w, x[2 * e]! / l, x[2 * e + 1]! / l, l)
  }
}

/** Calls fn(e, v, w, P/ℓ as [a, b, c] for [[a, b], [b, c]]) for each non-loop closed edge. */
function forEachEdgeProjector(
  m: PatternModel, p: Float64Array, lat: Lattice,
  fn: (e: number, v: number, w: number, a: number, b: number, c: number) => void,
): void {
  forEachEdgeUnit(m, p, lat, (e, v, w, ux, uy, l) => fn(e, v, w, (1 - ux * ux) / l, (-ux * uy) / l, (1 - uy * uy) / l))
}

/** Adds the 2×2 block s·[[a, b], [b, c]] at block (i, j). */
function addBlock(t: TripletBuilder, i: number, j: number, s: number, a: number, b: number, c: number): void {
  t.add(2 * i, 2 * j, s * a); t.add(2 * i, 2 * j + 1, s * b)
  t.add(2 * i + 1, 2 * j, s * b); t.add(2 * i + 1, 2 * j + 1, s * c)
}

/** J = ∂B/∂p as 2V × 2V triplets (duplicates sum). Symmetric; J·(translation) = 0. */
export function balanceJacobian(m: PatternModel, p: Float64Array, lat: Lattice): Triplets {
  const t = new TripletBuilder(2 * m.nVertices, 2 * m.nVertices, 16 * m.nEdges)
  forEachEdgeProjector(m, p, lat, (_e, v, w, a, b, c) => {
    addBlock(t, v, w, 1, a, b, c)
    addBlock(t, w, v, 1, a, b, c)
    addBlock(t, v, v, -1, a, b, c)
    addBlock(t, w, w, -1, a, b, c)
  })
  return t.build()
}

/**
 * ∂B/∂(ω1x, ω1y, ω2x, ω2y): a dense 2V × 4 row-major Float64Array
 * (entry (r, c) at out[4r + c]). Only edges with a non-zero shift contribute.
 */
export function balanceLatticeDerivative(
  m: PatternModel, p: Float64Array, lat: Lattice, out = new Float64Array(8 * m.nVertices),
): Float64Array {
  out.fill(0)
  forEachEdgeProjector(m, p, lat, (e, v, w, a, b, c) => {
    const k = [m.shift[4 * e]!, m.shift[4 * e + 1]!]
    for (let i = 0; i < 2; i++) {
      if (k[i] === 0) continue
      // column 2i is ω_i,x; column 2i+1 is ω_i,y; ∂u/∂ω_i = k_i P/ℓ
      for (const [vert, s] of [[v, k[i]!], [w, -k[i]!]] as const) {
        out[4 * (2 * vert) + 2 * i]! += s * a
        out[4 * (2 * vert) + 2 * i + 1]! += s * b
        out[4 * (2 * vert + 1) + 2 * i]! += s * b
        out[4 * (2 * vert + 1) + 2 * i + 1]! += s * c
      }
    }
  })
  return out
}
