/**
 * Phase families (domain.md §5–6): F(u, λ) = G(ψ(u); α(λ), K(λ)) without the pinned vertex's
 * equation, u = ψ_1..ψ_{V−1} (ψ_0 pinned: the global phase shift), n = V − 1. F_u is the
 * trailing block of ∂G/∂ψ (a weighted graph Laplacian, symmetric); F_λ is (∂G/∂α)·dα/dλ for
 * α paths and Σ_{e scaled} ±K_e⁰ sin φ_e for a weight scaling.
 */
import type { ContinuationProblem } from '../continuation/types'
import type { PatternModel } from '../pattern/model'
import { phaseAlphaDerivative, phaseDifferences, phaseJacobian, phaseResidual } from '../pattern/phases'
import type { FamilyPath } from '../types/family'
import { trailingBlock } from './reduce'
import { pinnedFirstVertexMargin } from './margin'
import { meanWeight } from '../pattern/phase-solve'

/** α(λ), dα/dλ and K(λ), dK/dλ of a phase path. */
export interface PhasePath {
  lambda0: number
  alpha(l: number): [number, number]
  dAlpha: [number, number]
  weights(l: number): Float64Array
  /** dK/dλ per edge (all zero for α paths). */
  dWeights: Float64Array
}

/** The phase path of `path` from the model's α and weights. */
export function phasePath(m: PatternModel, path: FamilyPath): PhasePath {
  const [a1, a2] = m.alpha
  const K0 = m.weight
  const zero = new Float64Array(m.nEdges)
  const fixedK = { weights: () => K0, dWeights: zero }
  switch (path.kind) {
    case 'alpha1': return { lambda0: a1, alpha: l => [l, a2], dAlpha: [1, 0], ...fixedK }
    case 'alpha2': return { lambda0: a2, alpha: l => [a1, l], dAlpha: [0, 1], ...fixedK }
    case 'alpha-line': {
      const [d1, d2] = path.direction
      if (d1 === 0 && d2 === 0) throw new Error('families: alpha-line direction must be non-zero')
      return { lambda0: 0, alpha: t => [a1 + t * d1, a2 + t * d2], dAlpha: [d1, d2], ...fixedK }
    }
    case 'weight-scale': {
      const dK = new Float64Array(m.nEdges)
      for (const id of path.edges) {
        const e = m.edgeIds.indexOf(id)
        if (e < 0) throw new Error(`families: unknown edge '${id}' in weight-scale`)
        dK[e] = K0[e]!
      }
      return { lambda0: 1, alpha: () => [a1, a2], dAlpha: [0, 0], weights: s => K0.map((k, e) => dK[e] ? s * k : k), dWeights: dK }
    }
    default:
      throw new Error(`families: '${path.kind}' is not a phase path`)
  }
}

/** Full ψ (V) from u with ψ_0 = pinned. */
function fullPsi(u: Float64Array, pinned: number): Float64Array {
  const psi = new Float64Array(u.length + 1)
  psi[0] = pinned
  psi.set(u, 1)
  return psi
}

/** The continuation problem of a phase path. */
export function phaseProblem(m: PatternModel, path: PhasePath): { problem: ContinuationProblem; psiAt: (u: Float64Array) => Float64Array } {
  const V = m.nVertices, n = V - 1
  const pinned = m.psi[0]!
  const G = new Float64Array(V)
  const problem: ContinuationProblem = {
    n,
    symmetric: true,
    residual(u, l, out) {
      phaseResidual(m, fullPsi(u, pinned), path.alpha(l), path.weights(l), G)
      out.set(G.subarray(1))
    },
    jacobian(u, l) {
      const psi = fullPsi(u, pinned), alpha = path.alpha(l), K = path.weights(l)
      const Fu = trailingBlock(phaseJacobian(m, psi, alpha, K), 1)
      const dA = phaseAlphaDerivative(m, psi, alpha, K)
      const Flambda = new Float64Array(n)
      for (let v = 1; v < V; v++) Flambda[v - 1] = dA[2 * v]! * path.dAlpha[0] + dA[2 * v + 1]! * path.dAlpha[1]
      // weight scaling: ∂G/∂λ = Σ_e dK_e sin φ_e at the edge's ends (same signs as G)
      phaseResidual(m, psi, alpha, path.dWeights, G)
      for (let v = 1; v < V; v++) Flambda[v - 1]! += G[v]!
      return { Fu, Flambda }
    },
    // the phase verdict's dimensionless margin: σ_min of the phase Jacobian on non-constant ψ, ÷ K̄
    rigidityMargin: pinnedFirstVertexMargin(V, 1, (_u, l) => 1 / meanWeight(path.weights(l))),
    diagnostics(u, l) {
      const phi = phaseDifferences(m, fullPsi(u, pinned), path.alpha(l))
      let minCos = Infinity
      for (let e = 0; e < m.nEdges; e++) minCos = Math.min(minCos, Math.cos(phi[e]!))
      const [a1, a2] = path.alpha(l)
      return { alpha1: a1, alpha2: a2, minCos }
    },
  }
  return { problem, psiAt: u => fullPsi(u, pinned) }
}
