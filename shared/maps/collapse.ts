/**
 * The collapse boundary of a torus pattern in the τ plane as a curve problem. At the boundary
 * the edge e: v → w has length 0 and its direction is free: contract e (p_w = p_v − T(k_e)),
 * give it an unknown angle θ, and ask for balance with u_e = (cos θ, sin θ):
 *   B(x) = Σ_{h at x, h ≠ e} u_h  ± (cos θ, sin θ) at v / w  = 0   at the vertices 1..V−1,
 * unknowns y = (positions of the other free vertices, θ, Im τ), λ = Re τ. This is the limit of
 * the balanced drawings as ℓ_e → 0 (for a degree-3 vertex: the Fermat–Torricelli condition that
 * the other two unit vectors sum to a unit vector, i.e. meet at 120°). Derived here.
 */
import type { ContinuationProblem } from '../continuation/types'
import { edgeLengths } from '../pattern/geometry'
import { halfEdgeVector, type PatternModel } from '../pattern/model'
import type { MapSettings } from '../types/maps'
import { finiteDifferenceProblem } from './augmented'
import { tauLattice } from './plane'

/** The collapse curve problem of edge `e` and the map from a drawing (2V positions) to its y. */
export function collapseCurveProblem(m: PatternModel, e: number, scaleBy: MapSettings['scaleBy']): { problem: ContinuationProblem; startY(positions: Float64Array, a: number, b: number): Float64Array; free: number[] } {
  const V = m.nVertices
  const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
  if (v === w) throw new Error('maps: a loop cannot collapse')
  const dep = w !== 0 ? w : v
  const free = Array.from({ length: V }, (_, x) => x).filter(x => x !== 0 && x !== dep)
  const at = tauLattice(m.lattice, scaleBy)
  const k1 = m.shift[4 * e]!, k2 = m.shift[4 * e + 1]!
  const P = new Float64Array(2 * V), B = new Float64Array(2 * V), x = new Float64Array(2)
  const N = 2 * free.length + 2
  const residual = (y: Float64Array, a: number, out: Float64Array) => {
    const lat = at(a, y[N - 1]!).lattice
    const T = [k1 * lat.w1[0] + k2 * lat.w2[0], k1 * lat.w1[1] + k2 * lat.w2[1]]
    P[0] = m.positions[0]!; P[1] = m.positions[1]!
    free.forEach((f, k) => { P[2 * f] = y[2 * k]!; P[2 * f + 1] = y[2 * k + 1]! })
    const s = dep === w ? -1 : 1, o = dep === w ? v : w
    P[2 * dep] = P[2 * o]! + s * T[0]!; P[2 * dep + 1] = P[2 * o + 1]! + s * T[1]!
    B.fill(0)
    for (let f = 0; f < m.nEdges; f++) {
      const a0 = m.edgeFrom[f]!, b0 = m.edgeTo[f]!
      if (a0 === b0) continue
      let ux: number, uy: number
      if (f === e) { ux = Math.cos(y[N - 2]!); uy = Math.sin(y[N - 2]!) } else {
        halfEdgeVector(m, P, lat, 2 * f, x)
        const l = Math.hypot(x[0]!, x[1]!); ux = x[0]! / l; uy = x[1]! / l
      }
      B[2 * a0]! += ux; B[2 * a0 + 1]! += uy; B[2 * b0]! -= ux; B[2 * b0 + 1]! -= uy
    }
    for (let j = 0; j < m.nWings; j++) {
      const h = m.vertexOf[2 * m.nEdges + j]!
      B[2 * h]! += m.wingDir[2 * j]!; B[2 * h + 1]! += m.wingDir[2 * j + 1]!
    }
    out.set(B.subarray(2))
  }
  return {
    problem: finiteDifferenceProblem(N, residual),
    free,
    startY(positions, a, b) {
      const y = new Float64Array(N)
      free.forEach((f, k) => { y[2 * k] = positions[2 * f]!; y[2 * k + 1] = positions[2 * f + 1]! })
      halfEdgeVector(m, positions, at(a, b).lattice, 2 * e, x)
      y[N - 2] = Math.atan2(x[1]!, x[0]!)
      y[N - 1] = b
      return y
    },
  }
}

/** The shortest closed edge of a drawing (the one a collapse event found). */
export function shortestEdge(m: PatternModel, positions: Float64Array, a: number, b: number, scaleBy: MapSettings['scaleBy']): number {
  const l = edgeLengths(m, positions, tauLattice(m.lattice, scaleBy)(a, b).lattice)
  let best = 0
  for (let e = 1; e < m.nEdges; e++) if (l[e]! < l[best]!) best = e
  return best
}
