/**
 * Phase families: F(u, λ) = the V − 1 level rows of vertical balance on cuts (H. Chen,
 * M. Traizet, arXiv 2103.15676, 2021, Def. 6.2; see shared/pattern/vertical-levels.ts) at
 * ψ(u), α(λ), K(λ); u = ψ_1..ψ_{V−1} (ψ_0 pinned: the global phase shift), n = V − 1. The level
 * structure is that of the document's drawing (phase paths do not move it, so they meet no
 * wall). F_u is the row Jacobian without the pinned column: symmetric (a weighted Laplacian
 * block) when every edge has one length, not otherwise. F_λ is (∂F/∂α)·dα/dλ for α paths and
 * Σ_{scaled terms} s·K_e⁰ sin φ_e for a weight scaling.
 */
import type { ContinuationProblem } from '../continuation/types'
import type { PatternModel } from '../pattern/model'
import { meanWeight, pinnedLevelJacobian } from '../pattern/phase-solve'
import { phaseDifferences } from '../pattern/phases'
import { levelAlphaDerivative, levelJacobian, levelResidual, modelLevels } from '../pattern/vertical-balance'
import type { FamilyPath } from '../types/family'
import { pinnedFirstVertexMargin } from './margin'

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
  const levels = modelLevels(m)
  if (levels.components !== 1) throw new Error('families: phase paths need a connected pattern')
  const column = Int32Array.from({ length: V }, (_, v) => v - 1)
  const G = new Float64Array(n)
  const problem: ContinuationProblem = {
    n,
    // one level: the rows are vertex sums (a Laplacian block); one unknown: 1 × 1
    symmetric: levels.singleLevel || n <= 1,
    residual(u, l, out) {
      levelResidual(m, levels, fullPsi(u, pinned), path.alpha(l), path.weights(l), out)
    },
    jacobian(u, l) {
      const psi = fullPsi(u, pinned), alpha = path.alpha(l), K = path.weights(l)
      const Fu = pinnedLevelJacobian(levelJacobian(m, levels, psi, alpha, K), column, n)
      const dA = levelAlphaDerivative(m, levels, psi, alpha, K)
      const Flambda = new Float64Array(n)
      for (let i = 0; i < n; i++) Flambda[i] = dA[2 * i]! * path.dAlpha[0] + dA[2 * i + 1]! * path.dAlpha[1]
      // weight scaling: ∂F/∂λ = the rows evaluated with the weights dK (F is linear in K)
      levelResidual(m, levels, psi, alpha, path.dWeights, G)
      for (let i = 0; i < n; i++) Flambda[i]! += G[i]!
      return { Fu, Flambda }
    },
    // one level: F_u is the pinned symmetric Laplacian block, so the monitor reads the phase verdict's
    // own margin (σ_min on non-constant ψ, ÷ K̄); several levels: σ_min of the pinned rows ÷ K̄
    ...(levels.singleLevel
      ? { rigidityMargin: pinnedFirstVertexMargin(V, 1, (_u, l) => 1 / meanWeight(path.weights(l))) }
      : { sigmaScale: (_u: Float64Array, l: number) => 1 / meanWeight(path.weights(l)) }),
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
