/**
 * The linear step of the balance solve (./balance-solve.ts) with the sparse LDLᵀ of shared/linalg.
 *
 * Unknowns: the coordinates of every vertex but vertex 0 (pinned). With J = ∂B/∂p restricted to
 * them and μ = ‖B‖/ℓ̄, the regularised Newton matrix M = J − μI is negative definite (−J = Hess L
 * is positive semidefinite, L being convex), so one LDLᵀ without pivoting always exists:
 *   torus:  M dx = −F.
 *   plane:  the scale row c (projection of the reference edge) makes the system (n+1) × n; its
 *           least-squares step (what the dense path's SVD gives) solves the augmented system
 *             [ αI  A ] [ r  ]   [ −F ]
 *             [ Aᵀ  0 ] [ dx ] = [  0 ],   A = [M; c],  α = 1/ℓ̄,
 *           because then Aᵀ(F + A dx) = 0 (Å. Björck, Numerical Methods for Least Squares
 *           Problems, SIAM 1996, §2.5.3). The zero block makes it indefinite: LDLᵀ, or the
 *           solver's LU when a pivot vanishes.
 * The triplet pattern is the same at every iteration, so the ordering and the symbolic analysis
 * are done once per solve.
 */
import { SparseSolver } from '../linalg/solver'
import { TripletBuilder, type Triplets } from '../linalg/triplets'

/** The scale row of the plane solve: coefficients on free coordinates. */
export interface ScaleRow { index: number[]; value: number[] }

/** Builds and solves the reduced regularised Newton systems of one balance solve. */
export class SparseBalanceStep {
  private readonly solver = new SparseSolver()
  /** Factorisations made (one per Newton iteration). */
  factorisations = 0

  /** `pinned` coordinates are dropped (vertex 0: 0 and 1); `scale` is the plane's extra row. */
  constructor(private readonly nFull: number, private readonly alpha: number, private readonly scale?: ScaleRow) {}

  /** Newton step for residual f (free coordinates, plus the scale residual last in the plane); null when no factorisation exists. */
  step(jacobian: Triplets, mu: number, f: Float64Array): Float64Array | null {
    const nf = this.nFull - 2
    const t = this.scale ? this.augmented(jacobian, mu) : this.square(jacobian, mu)
    const r = this.solver.factor(t, true)
    this.factorisations++
    if (!r.ok) return null
    if (!this.scale) {
      const rhs = new Float64Array(nf)
      for (let i = 0; i < nf; i++) rhs[i] = -f[i]!
      return r.factor.solve(rhs)
    }
    const rhs = new Float64Array(2 * nf + 1)
    for (let i = 0; i <= nf; i++) rhs[i] = -f[i]!
    const z = r.factor.solve(rhs)
    return z.slice(nf + 1)
  }

  /** Entries of J on the free coordinates (rows, columns shifted by the pinned pair). */
  private forFree(j: Triplets, add: (r: number, c: number, v: number) => void): void {
    for (let k = 0; k < j.count; k++) {
      const r = j.rows[k]! - 2, c = j.cols[k]! - 2
      if (r >= 0 && c >= 0) add(r, c, j.values[k]!)
    }
  }

  private square(j: Triplets, mu: number): Triplets {
    const nf = this.nFull - 2
    const b = new TripletBuilder(nf, nf, j.count + nf)
    this.forFree(j, (r, c, v) => b.add(r, c, v))
    for (let i = 0; i < nf; i++) b.add(i, i, -mu)
    return b.build()
  }

  private augmented(j: Triplets, mu: number): Triplets {
    const nf = this.nFull - 2
    const off = nf + 1 // dx block starts after the nf + 1 residual rows
    const sc = this.scale!
    const b = new TripletBuilder(2 * nf + 1, 2 * nf + 1, 2 * j.count + 3 * nf + 4 * sc.index.length + 1)
    for (let i = 0; i <= nf; i++) b.add(i, i, this.alpha)
    this.forFree(j, (r, c, v) => { b.add(r, off + c, v); b.add(off + c, r, v) })
    for (let i = 0; i < nf; i++) { b.add(i, off + i, -mu); b.add(off + i, i, -mu) }
    sc.index.forEach((c, k) => { b.add(nf, off + c, sc.value[k]!); b.add(off + c, nf, sc.value[k]!) })
    return b.build()
  }
}
