/**
 * Lattice families of a torus pattern: F(u, λ) = B(p(u), ω(λ)) without the pinned vertex's
 * equations, u = positions of vertices 1..V−1 (vertex 0 pinned: translations), n = 2V − 2.
 * ΣB = 0 identically without wings, so the dropped equations are implied.
 * F_u = the trailing block of J = ∂B/∂p (symmetric), F_λ = (∂B/∂ω)·dω/dλ (balance.ts).
 */
import type { ContinuationProblem } from '../continuation/types'
import { TripletBuilder } from '../linalg/triplets'
import { balanceJacobian, balanceLatticeDerivative, balanceResidual } from '../pattern/balance'
import { meanEdgeLength, minEdgeLength, totalLength } from '../pattern/geometry'
import type { PatternModel } from '../pattern/model'
import { contractedBalance, type ContractedResidual } from './collapse-limit'
import { drawingEvents, type DrawingAt } from './events'
import { conditionEvents, trivialPhases } from './walls'
import { latticeShapeArea, latticeTau, type LatticePath } from './lattice-paths'
import { addTrailingBlock } from './reduce'
import { pinnedFirstVertexMargin } from './margin'

/**
 * Event settings shared by the drawing families. With `locateTolerance` a collapse is located
 * where the edge reaches length 0 (families); without, where it passes the tolerance (maps).
 */
export interface DrawingEventOptions { collapseTolerance: number; orderFlip: boolean; terminal: boolean; locateTolerance?: number }

/** The continuation problem of a lattice path, with the map from u to the full drawing. */
export function torusLatticeProblem(m: PatternModel, path: LatticePath, ev: DrawingEventOptions): { problem: ContinuationProblem; drawingAt: DrawingAt; contracted: ContractedResidual } {
  const V = m.nVertices
  const n = 2 * V - 2
  const pin = [m.positions[0]!, m.positions[1]!]
  const full = new Float64Array(2 * V)
  const drawingAt: DrawingAt = (u, l) => {
    const p = new Float64Array(2 * V)
    p[0] = pin[0]!; p[1] = pin[1]!
    p.set(u, 2)
    return { p, lattice: path.at(l).lattice }
  }
  const contracted: ContractedResidual = (u, l, e, d, out) => { const x = drawingAt(u, l); out.set(contractedBalance(m, x.p, x.lattice, e, d).subarray(2)) }
  const B = new Float64Array(2 * V)
  const problem: ContinuationProblem = {
    n,
    symmetric: true,
    residual(u, l, out) {
      full[0] = pin[0]!; full[1] = pin[1]!; full.set(u, 2)
      balanceResidual(m, full, path.at(l).lattice, B)
      out.set(B.subarray(2))
    },
    jacobian(u, l) {
      full[0] = pin[0]!; full[1] = pin[1]!; full.set(u, 2)
      const { lattice, derivative } = path.at(l)
      const J = balanceJacobian(m, full, lattice)
      const b = new TripletBuilder(n, n, J.count)
      addTrailingBlock(J, 2, b)
      const dB = balanceLatticeDerivative(m, full, lattice)
      const Flambda = new Float64Array(n)
      for (let r = 2; r < 2 * V; r++) {
        Flambda[r - 2] = dB[4 * r]! * derivative[0]! + dB[4 * r + 1]! * derivative[1]! + dB[4 * r + 2]! * derivative[2]! + dB[4 * r + 3]! * derivative[3]!
      }
      return { Fu: b.build(), Flambda }
    },
    events: [...drawingEvents(m, drawingAt, {
      ...ev, latticeMoves: true,
      ...(ev.locateTolerance !== undefined ? {
        limit: {
          locateTolerance: ev.locateTolerance,
          contracted,
        },
      } : {}),
    }), ...conditionEvents(m, drawingAt, { terminal: false, walls: !trivialPhases(m) })],
    // the rigidity verdict's dimensionless margin: σ_min of J on the complement of translations, × ℓ̄
    rigidityMargin: pinnedFirstVertexMargin(V, 2, (u, l) => { const d = drawingAt(u, l); return meanEdgeLength(m, d.p, d.lattice) }),
    diagnostics(u, l) {
      const { p, lattice } = drawingAt(u, l)
      const tau = latticeTau(lattice)
      return {
        totalLength: totalLength(m, p, lattice),
        minEdgeRatio: minEdgeLength(m, p, lattice) / meanEdgeLength(m, p, lattice),
        tauRe: tau[0], tauIm: tau[1],
        area: lattice.w1[0] * lattice.w2[1] - lattice.w1[1] * lattice.w2[0],
        shapeArea: latticeShapeArea(lattice),
      }
    },
  }
  return { problem, drawingAt, contracted }
}
