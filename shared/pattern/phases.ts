/**
 * Phase data and vertical balance (docs/theory.md §5). For a closed edge e: v → w,
 *   φ_e = ψ(w) − ψ(v) + k_e·α,   G(v) += K_e sin φ_e,   G(w) −= K_e sin φ_e.
 * Jacobian ∂G/∂ψ = −(graph Laplacian with weights K_e cos φ_e): symmetric, possibly indefinite,
 * constants in its kernel. ∂G/∂α_i adds ±K_e cos φ_e · k_{e,i}. Loops cancel exactly.
 */
import { TripletBuilder, type Triplets } from '../linalg/triplets'
import type { PatternModel } from './model'

/** Phase differences φ_e of the closed edges (E) into `out`. */
export function phaseDifferences(
  m: PatternModel, psi: Float64Array, alpha: readonly [number, number],
  out = new Float64Array(m.nEdges),
): Float64Array {
  for (let e = 0; e < m.nEdges; e++) {
    out[e] = psi[m.edgeTo[e]!]! - psi[m.edgeFrom[e]!]!
      + m.shift[4 * e]! * alpha[0] + m.shift[4 * e + 1]! * alpha[1]
  }
  return out
}

/** Vertical balance G (V) into `out`; `weights` are K_e (E), usually `model.weight`. */
export function phaseResidual(
  m: PatternModel, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  out = new Float64Array(m.nVertices),
): Float64Array {
  out.fill(0)
  const phi = phaseDifferences(m, psi, alpha)
  for (let e = 0; e < m.nEdges; e++) {
    const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
    if (v === w) continue
    const s = weights[e]! * Math.sin(phi[e]!)
    out[v]! += s
    out[w]! -= s
  }
  return out
}

/** Calls fn(e, v, w, K_e cos φ_e) for every non-loop closed edge. */
function forEachCoupling(
  m: PatternModel, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  fn: (e: number, v: number, w: number, c: number) => void,
): void {
  const phi = phaseDifferences(m, psi, alpha)
  for (let e = 0; e < m.nEdges; e++) {
    const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
    if (v !== w) fn(e, v, w, weights[e]! * Math.cos(phi[e]!))
  }
}

/** ∂G/∂ψ as V × V triplets (duplicates sum); symmetric. */
export function phaseJacobian(
  m: PatternModel, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
): Triplets {
  const t = new TripletBuilder(m.nVertices, m.nVertices, 4 * m.nEdges)
  forEachCoupling(m, psi, alpha, weights, (_e, v, w, c) => {
    t.add(v, w, c); t.add(w, v, c)
    t.add(v, v, -c); t.add(w, w, -c)
  })
  return t.build()
}

/** ∂G/∂(α1, α2): dense V × 2 row-major (entry (v, i) at out[2v + i]). */
export function phaseAlphaDerivative(
  m: PatternModel, psi: Float64Array, alpha: readonly [number, number], weights: Float64Array,
  out = new Float64Array(2 * m.nVertices),
): Float64Array {
  out.fill(0)
  forEachCoupling(m, psi, alpha, weights, (e, v, w, c) => {
    for (let i = 0; i < 2; i++) {
      const k = m.shift[4 * e + i]!
      out[2 * v + i]! += c * k
      out[2 * w + i]! -= c * k
    }
  })
  return out
}

/** Distance of an angle to the nearest multiple of π, in [0, π/2]. */
export function distanceToMirror(phi: number): number {
  const r = ((phi % Math.PI) + Math.PI) % Math.PI
  return Math.min(r, Math.PI - r)
}

/** Distance of an angle to the nearest multiple of 2π, in [0, π]. */
export function distanceToZeroMod2Pi(x: number): number {
  const r = ((x % (2 * Math.PI)) + 2 * Math.PI) % (2 * Math.PI)
  return Math.min(r, 2 * Math.PI - r)
}
