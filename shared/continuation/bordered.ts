/**
 * Linear systems with the bordered matrix M = [[F_u, F_λ], [cᵀ]] ((n+1)×(n+1)), the workhorse of
 * pseudo-arclength continuation (H. B. Keller, "Numerical solution of bifurcation and nonlinear
 * eigenvalue problems", in Applications of Bifurcation Theory, Academic Press 1977).
 *
 * Route 1, bordering (block elimination): with one factorisation of F_u,
 *   F_u x₁ = f,  F_u x₂ = F_λ,  s = (g − c_uᵀx₁) / (c_λ − c_uᵀx₂),  x = x₁ − s x₂,
 * and det M = det F_u · (c_λ − c_uᵀx₂). Block elimination loses accuracy when F_u is nearly
 * singular (H. B. Keller, "The bordering algorithm and path following near singular points of
 * higher nullity", SIAM J. Sci. Stat. Comput. 4(4), 1983), so every solve checks its residual.
 * Route 2, when F_u cannot be factorised or the residual check fails: sparse LU of the full M.
 * A failure of both is reported as `{ ok: false }`, never thrown.
 */
import { SparseSolver, type FactorOutcome, type SolverOptions } from '../linalg/solver'
import { TripletBuilder, type Triplets } from '../linalg/triplets'
import { normInf } from '../linalg/vectors'

/** J = [F_u | F_λ] at a point. */
export interface PointJacobian { Fu: Triplets; Flambda: Float64Array }

/** Solution of a bordered system: x has length n+1 (u-part, then the λ-part). */
export type BorderedSolve = { ok: true; x: Float64Array } | { ok: false; reason: string }

/** Factorises F_u and bordered matrices, keeping each solver's pattern analysis between calls. */
export class BorderedSolver {
  private readonly fuSolver: SparseSolver
  private readonly fullSolver: SparseSolver
  /** Number of times the full bordered matrix had to be factorised. */
  fullFactorisations = 0

  constructor(readonly n: number, readonly symmetric: boolean, solver: SolverOptions, readonly tolerance: number) {
    this.fuSolver = new SparseSolver(solver)
    // The full bordered matrix is unsymmetric: always LU there.
    this.fullSolver = new SparseSolver({ ...solver, method: solver.method === 'dense' ? 'dense' : 'lu' })
  }

  /** Factorise F_u alone (inertia, σ_min, singularity checks). */
  factorFu(J: PointJacobian): FactorOutcome {
    try { return this.fuSolver.factor(J.Fu, this.symmetric) } catch (e) { return { ok: false, reason: String(e) } }
  }

  /** Prepare M = [[F_u, F_λ], [cᵀ]]; `fu` reuses an F_u factorisation made for the same J. */
  prepare(J: PointJacobian, c: Float64Array, fu?: FactorOutcome): BorderedMatrix {
    return new BorderedMatrix(this, J, c, fu ?? this.factorFu(J))
  }

  /** @internal factorise the full bordered matrix. */
  factorFull(J: PointJacobian, c: Float64Array): FactorOutcome {
    this.fullFactorisations++
    const n = this.n
    const b = new TripletBuilder(n + 1, n + 1, J.Fu.count + 2 * n + 1)
    for (let k = 0; k < J.Fu.count; k++) b.add(J.Fu.rows[k]!, J.Fu.cols[k]!, J.Fu.values[k]!)
    // Every border entry is stored, zero or not, so the pattern (and its analysis) never changes.
    for (let i = 0; i < n; i++) b.add(i, n, J.Flambda[i]!)
    for (let j = 0; j <= n; j++) b.add(n, j, c[j]!)
    try { return this.fullSolver.factor(b.build(), false) } catch (e) { return { ok: false, reason: String(e) } }
  }
}

/** One bordered matrix, ready for solves. */
export class BorderedMatrix {
  private x2?: Float64Array
  private denom = NaN
  private full?: FactorOutcome
  private readonly scale: number
  private readonly baseScale: number

  /** `x2` = F_u⁻¹F_λ when already known (it does not depend on c). */
  constructor(private readonly owner: BorderedSolver, readonly J: PointJacobian, readonly c: Float64Array, readonly fu: FactorOutcome, x2?: Float64Array, baseScale?: number) {
    this.baseScale = baseScale ?? Math.max(normInf(J.Fu.values.subarray(0, J.Fu.count)), normInf(J.Flambda))
    this.scale = Math.max(this.baseScale, normInf(c))
    if (fu.ok) {
      const n = owner.n
      if (x2) this.x2 = x2
      else this.x2 = fu.factor.solve(J.Flambda)
      let d = c[n]!
      for (let i = 0; i < n; i++) d -= c[i]! * this.x2[i]!
      this.denom = d
    }
  }

  /**
   * The same J with another last row c (the chord corrector at the next step): F_u, its
   * factorisation and F_u⁻¹F_λ are reused, only the scalar Schur complement is new.
   */
  withBorder(c: Float64Array): BorderedMatrix {
    return new BorderedMatrix(this.owner, this.J, c, this.fu, this.x2, this.baseScale)
  }

  /** Solve M x = (f, g). */
  solve(f: ArrayLike<number>, g: number): BorderedSolve {
    const n = this.owner.n
    if (this.fu.ok && this.denom !== 0 && Number.isFinite(this.denom)) {
      // f = 0 (the tangent system) needs no solve: x₁ = 0
      let zero = true
      for (let i = 0; i < n && zero; i++) if (f[i] !== 0) zero = false
      const x1 = zero ? new Float64Array(n) : this.fu.factor.solve(f)
      let s = g
      for (let i = 0; i < n; i++) s -= this.c[i]! * x1[i]!
      s /= this.denom
      const x = new Float64Array(n + 1)
      for (let i = 0; i < n; i++) x[i] = x1[i]! - s * this.x2![i]!
      x[n] = s
      if (this.residualOk(x, f, g)) return { ok: true, x }
    }
    this.full ??= this.owner.factorFull(this.J, this.c)
    if (!this.full.ok) return { ok: false, reason: `bordered matrix could not be factorised: ${this.full.reason}` }
    const rhs = new Float64Array(n + 1)
    for (let i = 0; i < n; i++) rhs[i] = f[i]!
    rhs[n] = g
    const x = this.full.factor.solve(rhs)
    if (!x.every(Number.isFinite)) return { ok: false, reason: 'bordered solve produced non-finite values' }
    return { ok: true, x }
  }

  /** Sign and log-magnitude of det M, or undefined when M could not be factorised. */
  det(): { sign: number; logAbs: number } | undefined {
    if (this.fu.ok && this.denom !== 0 && Number.isFinite(this.denom)) {
      return { sign: this.fu.factor.detSign * Math.sign(this.denom), logAbs: this.fu.factor.logAbsDet + Math.log(Math.abs(this.denom)) }
    }
    this.full ??= this.owner.factorFull(this.J, this.c)
    if (!this.full.ok) return undefined
    return { sign: this.full.factor.detSign, logAbs: this.full.factor.logAbsDet }
  }

  /** True when the full bordered matrix was factorised (bordering was not accurate enough). */
  get usedFullMatrix(): boolean { return this.full !== undefined }

  private residualOk(x: Float64Array, f: ArrayLike<number>, g: number): boolean {
    const n = this.owner.n
    const { Fu, Flambda } = this.J
    const r = new Float64Array(n + 1)
    for (let k = 0; k < Fu.count; k++) r[Fu.rows[k]!]! += Fu.values[k]! * x[Fu.cols[k]!]!
    let rl = -g
    for (let i = 0; i < n; i++) { r[i]! += Flambda[i]! * x[n]! - f[i]!; rl += this.c[i]! * x[i]! }
    rl += this.c[n]! * x[n]!
    r[n] = rl
    const bound = this.owner.tolerance * (Math.max(normInf(f), Math.abs(g)) + this.scale * normInf(x))
    return normInf(r) <= bound
  }
}
