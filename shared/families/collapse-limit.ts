/**
 * Where a collapse really happens. The collapse event of a family fires where the shortest edge
 * passes `collapseTolerance` × the mean length: the run stops there (F_u grows like 1/length, so
 * continuing further only costs steps). The parameter reported for the collapse is that of the
 * limit, found by Newton on the contracted-edge system (derived here; the same limit the map's
 * collapse curves use, shared/maps/collapse.ts):
 *   unknowns (u, θ, λ) ∈ R^{n+2};
 *   F(u, λ) with the unit vector of the collapsing edge e replaced by d = (cos θ, sin θ)  (n rows),
 *   x_e(u, λ) = 0                                                                        (2 rows).
 * As ℓ_e → 0 along balanced drawings, u_e stays a unit vector and the other edges stay smooth, so
 * the limit solves this square system; for a degree-3 vertex it is the Fermat–Torricelli
 * condition that the two other unit vectors meet at 120°. Jacobian by central differences,
 * dense (ml-matrix LU): meant for patterns of up to a few hundred unknowns, above that the
 * collapse is reported where the tolerance was crossed, marked as not located.
 */
import { Matrix, solve } from 'ml-matrix'
import type { EventLimit } from '../continuation/types'
import { balanceResidual } from '../pattern/balance'
import { edgeLengths, edgeVectors } from '../pattern/geometry'
import type { Lattice, PatternModel } from '../pattern/model'
import type { DrawingAt } from './events'

/** The family's residual rows with the unit vector of edge e replaced by d (same rows as F). */
export type ContractedResidual = (u: Float64Array, lambda: number, e: number, d: [number, number], out: Float64Array) => void

/** Largest n + 2 the dense Newton of the limit takes on. */
export const COLLAPSE_LIMIT_MAX_UNKNOWNS = 600

/** B (2V) of the drawing with edge e's unit vector replaced by d (ℓ_e may be 0). */
export function contractedBalance(m: PatternModel, p: Float64Array, lat: Lattice, e: number, d: [number, number]): Float64Array {
  // with from = to the edge counts as a loop, which balance skips (loops cancel); d is added instead
  const edgeFrom = m.edgeFrom.slice(); edgeFrom[e] = m.edgeTo[e]!
  const B = balanceResidual({ ...m, edgeFrom }, p, lat)
  const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
  B[2 * v]! += d[0]; B[2 * v + 1]! += d[1]
  B[2 * w]! -= d[0]; B[2 * w + 1]! -= d[1]
  return B
}

/** The shortest edge between two different vertices (loops cannot collapse), or −1. */
export function shortestOpenableEdge(m: PatternModel, p: Float64Array, lat: Lattice): number {
  const l = edgeLengths(m, p, lat)
  let best = -1
  for (let e = 0; e < m.nEdges; e++) if (m.edgeFrom[e] !== m.edgeTo[e] && (best < 0 || l[e]! < l[best]!)) best = e
  return best
}

/** Collapsing-edge direction that balances the contracted drawing best, from a vertex in F's rows. */
export function contractedDirection(m: PatternModel, p: Float64Array, lat: Lattice, e: number): [number, number] {
  const B = contractedBalance(m, p, lat, e, [0, 0])
  const v = m.edgeFrom[e]!, w = m.edgeTo[e]!
  // vertex 0 is pinned and its rows are not in F: read d from the other end
  const [x, y] = w !== 0 ? [B[2 * w]!, B[2 * w + 1]!] : [-B[2 * v]!, -B[2 * v + 1]!]
  const r = Math.hypot(x, y)
  return r > 0 ? [x / r, y / r] : [1, 0]
}

/**
 * max|residual| of a collapse limit for re-checking a stored one: the family's rows with the
 * shortest edge's direction chosen to balance (contractedDirection), and that edge's length
 * relative to the mean.
 */
export function collapseLimitResidual(m: PatternModel, at: DrawingAt, residual: ContractedResidual, u: Float64Array, lambda: number): number {
  const d = at(u, lambda)
  const mm = d.model ?? m
  const e = shortestOpenableEdge(mm, d.p, d.lattice)
  if (e < 0) return NaN
  const F = new Float64Array(u.length)
  residual(u, lambda, e, contractedDirection(mm, d.p, d.lattice, e), F)
  const l = edgeLengths(mm, d.p, d.lattice)
  const mean = l.reduce((s, x) => s + x, 0) / l.length
  return Math.max(F.reduce((s, v) => Math.max(s, Math.abs(v)), 0), l[e]! / mean)
}

/**
 * Newton on the contracted-edge system from a drawing near the collapse (u0, λ0). Returns the
 * limit (λ, u with x_e = 0), the precision reached (last |Δλ| / max(1, |λ|)), or undefined when
 * the system is too large or there is no closed edge between two vertices.
 */
export function collapseLimit(
  m: PatternModel, at: DrawingAt, residual: ContractedResidual, u0: Float64Array, l0: number, tolerance: number, maxIterations = 30,
): EventLimit | undefined {
  const n = u0.length, N = n + 2
  if (N > COLLAPSE_LIMIT_MAX_UNKNOWNS) return undefined
  const d0 = at(u0, l0)
  const e = shortestOpenableEdge(d0.model ?? m, d0.p, d0.lattice)
  if (e < 0) return undefined
  const x0 = edgeVectors(d0.model ?? m, d0.p, d0.lattice)
  const z = new Float64Array(N)
  z.set(u0); z[n] = Math.atan2(x0[2 * e + 1]!, x0[2 * e]!); z[n + 1] = l0
  const F = new Float64Array(n)
  const G = (y: Float64Array, out: Float64Array): void => {
    const u = y.subarray(0, n), l = y[n + 1]!
    residual(u, l, e, [Math.cos(y[n]!), Math.sin(y[n]!)], F)
    out.set(F)
    const d = at(u, l)
    const x = edgeVectors(d.model ?? m, d.p, d.lattice)
    out[n] = x[2 * e]!; out[n + 1] = x[2 * e + 1]!
  }
  const g = new Float64Array(N), gp = new Float64Array(N), gm = new Float64Array(N)
  let precision = Infinity, residualNorm = Infinity, iterations = 0
  for (; iterations < maxIterations; iterations++) {
    G(z, g)
    residualNorm = g.reduce((s, v) => Math.max(s, Math.abs(v)), 0)
    if (!Number.isFinite(residualNorm)) break
    if (residualNorm <= 1e-13 && precision <= tolerance) break
    const J = new Matrix(N, N)
    for (let j = 0; j < N; j++) {
      const h = 1e-7 * (1 + Math.abs(z[j]!))
      const zp = z.slice(), zm = z.slice()
      zp[j]! += h; zm[j]! -= h
      G(zp, gp); G(zm, gm)
      for (let i = 0; i < N; i++) J.set(i, j, (gp[i]! - gm[i]!) / (2 * h))
    }
    const dz = solve(J, Matrix.columnVector(Array.from(g, v => -v))).getColumn(0)
    if (!dz.every(Number.isFinite)) break
    for (let j = 0; j < N; j++) z[j]! += dz[j]!
    precision = Math.abs(dz[n + 1]!) / Math.max(1, Math.abs(z[n + 1]!))
  }
  const converged = residualNorm <= 1e-10 && precision <= tolerance
  if (!converged) return undefined
  return {
    lambda: z[n + 1]!, u: Array.from(z.subarray(0, n)), precision, located: true,
    label: `edge ${m.edgeIds[e]} reaches length 0`,
  }
}
