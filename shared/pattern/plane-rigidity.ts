/**
 * Rigidity of a plane pattern as published (H. Chen, "Gluing Karcher–Scherk saddle towers II:
 * singly periodic minimal surfaces", Comm. Anal. Geom. 32, 2024, Def. 1). The unknowns are the
 * positions p AND the directions θ_r of the open wings. With J = ∂B/∂p and R the 2V × |R| matrix
 * whose column r holds u_r^⊥ = (−sin θ_r, cos θ_r) in the two rows of v(r),
 *   rigid ⇔ M = [ℓ̄·J | R] has rank 2V (surjective; ℓ̄ = mean closed-edge length).
 * Then the balanced drawings near the given one, modulo translation, form a manifold of
 * dimension dim D = 2V − 2 + |R| − rank M (|R| − 2 when rigid). When not rigid, a left null
 * vector y of M is the witness: a parallel redrawing (y ∈ ker J, J symmetric) that pushes no
 * wing's root sideways. Singular values by the SVD of Mᵀ (ml-matrix; G. H. Golub, C. F. Van Loan,
 * Matrix Computations, 4th ed., 2013, §8.6).
 */
import { Matrix, SingularValueDecomposition } from 'ml-matrix'
import { balanceJacobian } from './balance'
import { meanEdgeLength } from './geometry'
import type { Lattice, PatternModel } from './model'
import { tripletsToDense } from './spectrum'

/** The published plane rigidity numbers. */
export interface PlaneRigidityResult {
  /** 2V: the rank needed. */
  rows: number
  /** 2V + |R|. */
  columns: number
  rank: number
  /** σ_2V(M), the smallest of the 2V singular values (dimensionless). */
  sigma: number
  /** Dimension of the family D of balanced drawings near this one, modulo translation. */
  familyDimension: number
  lengthScale: number
  rigid: boolean
  tolerance: number
  /** Left null vector y of M per vertex [y_x, y_y] (unit), when not rigid. */
  witness?: [number, number][]
}

/** The matrix M = [ℓ̄·J | R] (2V × (2V + |R|)) of the drawing (p, lat). */
export function planeRigidityMatrix(m: PatternModel, p: Float64Array, lat: Lattice): { M: Matrix; lengthScale: number } {
  const V = m.nVertices, W = m.nWings
  const lengthScale = meanEdgeLength(m, p, lat)
  const J = tripletsToDense(balanceJacobian(m, p, lat))
  const M = Matrix.zeros(2 * V, 2 * V + W)
  for (let i = 0; i < 2 * V; i++) for (let j = 0; j < 2 * V; j++) M.set(i, j, lengthScale * J.get(i, j))
  for (let r = 0; r < W; r++) {
    const v = m.vertexOf[2 * m.nEdges + r]!
    M.set(2 * v, 2 * V + r, -m.wingDir[2 * r + 1]!)
    M.set(2 * v + 1, 2 * V + r, m.wingDir[2 * r]!)
  }
  return { M, lengthScale }
}

/** Plane rigidity of the drawing (p, lat); rank counts singular values above `tolerance`. */
export function analyzePlaneRigidity(m: PatternModel, p: Float64Array = m.positions, lat: Lattice = m.lattice, tolerance = 1e-7): PlaneRigidityResult {
  const V = m.nVertices, W = m.nWings
  const { M, lengthScale } = planeRigidityMatrix(m, p, lat)
  // SVD of the tall Mᵀ: its right singular vectors are M's left singular vectors
  const svd = new SingularValueDecomposition(M.transpose(), { autoTranspose: false })
  const sv = svd.diagonal.slice(0, 2 * V)
  let k = 0
  for (let i = 1; i < sv.length; i++) if (sv[i]! < sv[k]!) k = i
  const sigma = sv.length ? sv[k]! : Infinity
  const rank = sv.filter(s => s > tolerance).length
  const rigid = rank === 2 * V
  const out: PlaneRigidityResult = {
    rows: 2 * V, columns: 2 * V + W, rank, sigma, familyDimension: 2 * V - 2 + W - rank, lengthScale, rigid, tolerance,
  }
  if (!rigid) {
    const y = svd.rightSingularVectors.getColumn(k)
    out.witness = Array.from({ length: V }, (_, v) => [y[2 * v]!, y[2 * v + 1]!] as [number, number])
  }
  return out
}
