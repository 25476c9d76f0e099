/**
 * Wing rotation of a plane pattern. Count (docs/theory.md §4): B is 0-homogeneous in p, so with
 * ΣB = Σ_open u_h = 0 and ⟨B, p⟩ = −L(p) only 2V − 3 of the 2V balance equations are
 * independent of the 2V − 3 position unknowns left after pinning translations and the scale —
 * balanced drawings need one extra condition L = 0 on the wing data. Turning one wing set by λ
 * alone therefore gives isolated solutions, not a family. We add one unknown: a second,
 * user-chosen wing set ("compensate") turns by an angle μ solved with the positions.
 * Both sets must have zero direction sum, so Σ_open u_h stays 0 for all λ, μ.
 *
 * Unknowns u = (p_1 … p_{V−1}, μ), n = 2V − 1 (vertex 0 pinned). Equations: B at vertices
 * 1..V−1 (B at vertex 0 follows from ΣB = 0) and the scale ⟨x_{e0}, d0⟩ = ℓ0 on the first
 * non-loop edge e0 with the document's direction d0 and length ℓ0 (as the balance solve does). F_u is not symmetric (μ column).
 */
import type { ContinuationProblem } from '../continuation/types'
import { TripletBuilder } from '../linalg/triplets'
import { balanceJacobian, balanceResidual } from '../pattern/balance'
import { edgeVectors, meanEdgeLength, minEdgeLength, totalLength } from '../pattern/geometry'
import type { PatternModel } from '../pattern/model'
import { contractedBalance, type ContractedResidual } from './collapse-limit'
import { drawingEvents, type DrawingAt } from './events'
import { conditionEvents } from './walls'
import { addTrailingBlock } from './reduce'
import type { DrawingEventOptions } from './torus'

/** Wing indices of the listed ids; throws on unknown ids or a non-zero direction sum. */
function wingSet(m: PatternModel, ids: string[], name: string): number[] {
  const idx = ids.map((id) => {
    const j = m.wingIds.indexOf(id)
    if (j < 0) throw new Error(`families: unknown wing '${id}' in ${name}`)
    return j
  })
  let sx = 0, sy = 0
  for (const j of idx) { sx += m.wingDir[2 * j]!; sy += m.wingDir[2 * j + 1]! }
  if (Math.hypot(sx, sy) > 1e-9) throw new Error(`families: the directions of the ${name} wings must sum to zero (sum = (${sx.toPrecision(3)}, ${sy.toPrecision(3)}))`)
  return idx
}

/** The continuation problem of a wing rotation; u's last component is the compensating angle μ. */
export function planeWingProblem(m: PatternModel, rotate: string[], compensate: string[], ev: DrawingEventOptions): { problem: ContinuationProblem; drawingAt: DrawingAt; contracted: ContractedResidual } {
  if (m.space !== 'plane') throw new Error('families: wing rotation needs a plane pattern')
  const S = wingSet(m, rotate, 'rotate'), T = wingSet(m, compensate, 'compensate')
  if (S.some(j => T.includes(j))) throw new Error('families: a wing cannot be in both rotate and compensate')
  const V = m.nVertices, n = 2 * V - 1
  const lat = m.lattice
  const e0 = Array.from({ length: m.nEdges }, (_, e) => e).find(e => m.edgeFrom[e] !== m.edgeTo[e])
  if (e0 === undefined) throw new Error('families: wing rotation needs a closed edge between two vertices (it fixes the scale)')
  // pin and scale come from the document's drawing, as in the balance solve (balance-solve.ts)
  const p0 = m.positions
  const x0 = edgeVectors(m, p0, lat)
  const l0 = Math.hypot(x0[2 * e0]!, x0[2 * e0 + 1]!)
  const d0 = [x0[2 * e0]! / l0, x0[2 * e0 + 1]! / l0]
  const base = m.wingDir.slice()
  const pin = [p0[0]!, p0[1]!]

  /** The model with the wings turned: S by λ, T by μ. */
  const modelAt = (l: number, mu: number): PatternModel => {
    const dir = base.slice()
    for (const [set, a] of [[S, l], [T, mu]] as const) {
      const c = Math.cos(a), s = Math.sin(a)
      for (const j of set) { dir[2 * j] = c * base[2 * j]! - s * base[2 * j + 1]!; dir[2 * j + 1] = s * base[2 * j]! + c * base[2 * j + 1]! }
    }
    return { ...m, wingDir: dir }
  }
  const drawingAt: DrawingAt = (u, l) => {
    const p = new Float64Array(2 * V)
    p[0] = pin[0]!; p[1] = pin[1]!
    p.set(u.subarray(0, n - 1), 2)
    return { p, lattice: lat, model: modelAt(l, u[n - 1]!) }
  }
  /** d/dangle of the turned wings of `set`, summed per vertex, into col (2V, interleaved). */
  const turnDerivative = (mm: PatternModel, set: number[], col: Float64Array): void => {
    for (const j of set) {
      const v = mm.vertexOf[2 * mm.nEdges + j]!
      col[2 * v]! -= mm.wingDir[2 * j + 1]!
      col[2 * v + 1]! += mm.wingDir[2 * j]!
    }
  }
  const scaleRow = (p: Float64Array): number => {
    const x = edgeVectors(m, p, lat)
    return x[2 * e0]! * d0[0]! + x[2 * e0 + 1]! * d0[1]! - l0
  }
  const contracted: ContractedResidual = (u, l, e, d, out) => {
    const x = drawingAt(u, l)
    out.set(contractedBalance(x.model!, x.p, lat, e, d).subarray(2))
    out[n - 1] = scaleRow(x.p)
  }
  const problem: ContinuationProblem = {
    n,
    symmetric: false,
    residual(u, l, out) {
      const { p, model } = drawingAt(u, l)
      const B = balanceResidual(model!, p, lat)
      out.set(B.subarray(2))
      out[n - 1] = scaleRow(p)
    },
    jacobian(u, l) {
      const { p, model } = drawingAt(u, l)
      const J = balanceJacobian(model!, p, lat)
      const b = new TripletBuilder(n, n, J.count + 2 * V + 4)
      addTrailingBlock(J, 2, b)
      const colMu = new Float64Array(2 * V), colL = new Float64Array(2 * V)
      turnDerivative(model!, T, colMu)
      turnDerivative(model!, S, colL)
      for (let r = 2; r < 2 * V; r++) b.add(r - 2, n - 1, colMu[r]!)
      const from = m.edgeFrom[e0]!, to = m.edgeTo[e0]!
      for (const [v, s] of [[to, 1], [from, -1]] as const) {
        if (v === 0) continue
        b.add(n - 1, 2 * v - 2, s * d0[0]!); b.add(n - 1, 2 * v - 1, s * d0[1]!)
      }
      const Flambda = new Float64Array(n)
      Flambda.set(colL.subarray(2), 0)
      return { Fu: b.build(), Flambda }
    },
    events: [...drawingEvents(m, drawingAt, {
      ...ev, latticeMoves: false,
      ...(ev.locateTolerance !== undefined ? {
        limit: {
          locateTolerance: ev.locateTolerance,
          contracted,
        },
      } : {}),
    }), ...conditionEvents(m, drawingAt, { terminal: false, walls: false, planeRankTolerance: 1e-7 })],
    // F_u is unsymmetric here (the μ column, the scale row): σ_min(F_u)·ℓ̄, dimensionless
    sigmaScale(u, l) { return meanEdgeLength(m, drawingAt(u, l).p, lat) },
    diagnostics(u, l) {
      const { p } = drawingAt(u, l)
      return { totalLength: totalLength(m, p, lat), minEdgeRatio: minEdgeLength(m, p, lat) / meanEdgeLength(m, p, lat), compensateAngle: u[n - 1]! }
    },
  }
  return { problem, drawingAt, contracted }
}
