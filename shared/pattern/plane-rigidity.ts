/**
 * Rigidity of a plane pattern as published (H. Chen, "Gluing Karcher–Scherk saddle towers II:
 * singly periodic minimal surfaces", Comm. Anal. Geom. 32, 2024, Def. 1). The unknowns are the
 * positions p AND the directions θ_r of the open wings. With J = ∂B/∂p and R the 2V × |R| matrix
 * whose column r holds u_r^⊥ = (−sin θ_r, cos θ_r) in the two rows of v(r),
 *   rigid ⇔ M = [ℓ̄·J | R] has rank 2V (surjective; ℓ̄ = mean closed-edge length).
 * Then the balanced drawings near the given one, modulo translation, form a manifold of
 * dimension dim D = 2V − 2 + |R| − rank M (|R| − 2 when rigid). When not rigid, a left null
 * vector y of M is the witness: a parallel redrawing (y ∈ ker J, J symmetric) that pushes no
 * wing's root sideways. The squared singular values of M are the eigenvalues of the symmetric
 * 2V × 2V matrix M Mᵀ = ℓ̄² J² + R Rᵀ (G. H. Golub, C. F. Van Loan, Matrix Computations, 4th ed.,
 * 2013, §8.6); its eigenvectors are M's left singular vectors. Dense (ml-matrix) up to
 * `maxDenseVertices`; above, M Mᵀ is sparse and the smallest eigenvalue and its inertia come from
 * the sparse LDLᵀ + inverse iteration of rigidity-sparse.ts.
 */
import { EigenvalueDecomposition, Matrix } from 'ml-matrix'
import { TripletBuilder } from '../linalg/triplets'
import { balanceJacobian } from './balance'
import { meanEdgeLength } from './geometry'
import type { Lattice, PatternModel } from './model'
import { sparseRigidity } from './rigidity-sparse'
import { tripletsToDense } from '../linalg/dense'

/** The published plane rigidity numbers. */
export interface PlaneRigidityResult {
  /** Dense eigenvalues of M Mᵀ, or sparse LDLᵀ inertia with inverse iteration. */
  method: 'dense' | 'sparse'
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

/** M Mᵀ as sparse triplets: ℓ̄² J·J (J symmetric) plus R Rᵀ (2 × 2 blocks at the wings' towers). */
function gramTriplets(m: PatternModel, p: Float64Array, lat: Lattice, lengthScale: number) {
  const J = balanceJacobian(m, p, lat)
  const n = 2 * m.nVertices
  const rows: Map<number, number>[] = Array.from({ length: n }, () => new Map())
  for (let k = 0; k < J.count; k++) {
    const r = J.rows[k]!, c = J.cols[k]!
    rows[r]!.set(c, (rows[r]!.get(c) ?? 0) + J.values[k]!)
  }
  const b = new TripletBuilder(n, n, 8 * J.count + 4 * m.nWings)
  const s2 = lengthScale * lengthScale
  // (J J)_{ij} = Σ_k J_ik J_kj with J symmetric: for each k, all pairs of its row entries
  for (let k = 0; k < n; k++) {
    const entries = [...rows[k]!.entries()]
    for (const [i, a] of entries) for (const [j, c] of entries) b.add(i, j, s2 * a * c)
  }
  for (let r = 0; r < m.nWings; r++) {
    const v = m.vertexOf[2 * m.nEdges + r]!
    const nx = -m.wingDir[2 * r + 1]!, ny = m.wingDir[2 * r]!
    b.add(2 * v, 2 * v, nx * nx); b.add(2 * v, 2 * v + 1, nx * ny)
    b.add(2 * v + 1, 2 * v, ny * nx); b.add(2 * v + 1, 2 * v + 1, ny * ny)
  }
  return b.build()
}

/** Plane rigidity of the drawing (p, lat); rank counts singular values above `tolerance`. */
export function analyzePlaneRigidity(
  m: PatternModel, p: Float64Array = m.positions, lat: Lattice = m.lattice, tolerance = 1e-7, maxDenseVertices = 150,
): PlaneRigidityResult {
  const V = m.nVertices, W = m.nWings
  const base = { rows: 2 * V, columns: 2 * V + W, tolerance }
  if (V > maxDenseVertices) {
    const lengthScale = meanEdgeLength(m, p, lat)
    const s = sparseRigidity(gramTriplets(m, p, lat, lengthScale), [], [], tolerance * tolerance)
    const zero = s.inertia.zero + s.inertia.negative
    const rank = 2 * V - zero
    const rigid = zero === 0
    return {
      ...base, method: 'sparse', rank, sigma: Math.sqrt(Math.max(0, s.sigmaMin)), familyDimension: 2 * V - 2 + W - rank, lengthScale, rigid,
      ...(rigid ? {} : { witness: Array.from({ length: V }, (_, v) => [s.mode[2 * v]!, s.mode[2 * v + 1]!] as [number, number]) }),
    }
  }
  const { M, lengthScale } = planeRigidityMatrix(m, p, lat)
  const G = M.mmul(M.transpose())
  const eig = new EigenvalueDecomposition(G, { assumeSymmetric: true })
  const ev = eig.realEigenvalues
  let k = 0
  for (let i = 1; i < ev.length; i++) if (ev[i]! < ev[k]!) k = i
  const sigma = ev.length ? Math.sqrt(Math.max(0, ev[k]!)) : Infinity
  const rank = ev.filter(x => Math.sqrt(Math.max(0, x)) > tolerance).length
  const rigid = rank === 2 * V
  const out: PlaneRigidityResult = { ...base, method: 'dense', rank, sigma, familyDimension: 2 * V - 2 + W - rank, lengthScale, rigid }
  if (!rigid) {
    const y = eig.eigenvectorMatrix.getColumn(k)
    out.witness = Array.from({ length: V }, (_, v) => [y[2 * v]!, y[2 * v + 1]!] as [number, number])
  }
  return out
}
