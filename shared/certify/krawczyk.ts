/**
 * Existence and uniqueness of a zero of F near x̃, proven in floating point: the Krawczyk
 * operator (R. Krawczyk, "Newton-Algorithmen zur Bestimmung von Nullstellen mit Fehlerschranken",
 * Computing 4, 1969; R. E. Moore, "A test for existence of solutions to nonlinear systems",
 * SIAM J. Numer. Anal. 14, 1977) in the radii-polynomial form of S. Day, J.-P. Lessard,
 * K. Mischaikow, "Validated continuation for equilibria of PDEs", SIAM J. Numer. Anal. 45, 2007.
 *
 * Norm: the max-norm ‖x‖∞ = maxᵢ |xᵢ| on the unknowns and its induced row-sum norm on matrices;
 * the ball B(x̃, r) is the box x̃ ± r. With C ≈ F'(x̃)⁻¹ (any matrix: rigour never depends on it),
 *   Y    ≥ ‖C F(x̃)‖∞,    Z(r) ≥ sup_{y ∈ B(x̃, r)} ‖I − C F'(y)‖∞   (interval arithmetic),
 * if p(r) = Y + Z(r)·r − r < 0 then T(x) = x − C F(x) maps B(x̃, r) into itself as a contraction
 * (mean value form with the enclosure of F' over the box), so F has exactly one zero in B(x̃, r),
 * C and every F'(y) there are invertible — which proves rigidity at that zero. The smallest such r
 * bounds the distance of the true zero from x̃ (existence), the largest is the radius of
 * uniqueness. Z(r) is split as Z₀ + Σ_k |C_ik| ρ_k(r) with Z₀ ≥ ‖I − C J̃‖ (J̃ the midpoint
 * Jacobian, one product n·nnz) and ρ_k(r) the row sums of |F'(B) − J̃| (nnz per radius), so each
 * radius costs O(n² + nnz); C comes from n sparse solves with one factorisation of J̃.
 * Rounding: dot products use the a-priori bound γ_m Σ|aᵢbᵢ| (./round.ts), other bounds succ/pred.
 */
import { SparseSolver } from '../linalg/solver'
import { TripletBuilder } from '../linalg/triplets'
import { gamma, pred, succ, UNDERFLOW_PER_TERM } from './round'
import type { IntervalSystem, IntervalTriplets } from './system'

/** Why a certificate could not be given. */
export type NotCertifiedReason = 'not-rigid' | 'too-large' | 'enclosure-too-wide'

/** A proven unique zero, or the reason there is no proof. */
export type ZeroCertificate =
  | {
    certified: true
    /** Unknowns n. */
    size: number
    /** Smallest radius proven: the true zero lies within rMin of x̃ (max-norm). */
    rMin: number
    /** Largest radius proven: the zero is the only one within rMax of x̃. */
    rMax: number
    /** Y ≥ ‖C F(x̃)‖∞ and Z₀ ≥ ‖I − C F'(x̃)‖∞. */
    y: number
    z0: number
    norm: 'max'
  }
  | { certified: false; size: number; reason: NotCertifiedReason; detail: string }

/** Options; defaults in {@link DEFAULT_CERTIFY_OPTIONS}. */
export interface CertifyOptions {
  /** Above this many unknowns: "not certified: too large" (measured by `npm run bench`). */
  maxSize?: number
  /** Condition estimate ‖C‖∞‖J̃‖∞ above which a failed proof is reported as "not rigid". */
  singularCondition?: number
  /** Bisection steps for the largest radius. */
  bisectionSteps?: number
  /** Symmetric Jacobian: LDLᵀ instead of LU for C. */
  symmetric?: boolean
  /** Smallest radius wanted (segments: the ball must reach both end points' boxes). */
  minRadius?: number
}

export const DEFAULT_CERTIFY_OPTIONS: Required<CertifyOptions> = {
  maxSize: 1400,
  singularCondition: 1e11,
  bisectionSteps: 12,
  symmetric: false,
  minRadius: 0,
}

/** Fills defaults and rejects nonsense. */
export function resolveCertifyOptions(o: CertifyOptions = {}): Required<CertifyOptions> {
  const r = { ...DEFAULT_CERTIFY_OPTIONS, ...o }
  if (!(Number.isInteger(r.maxSize) && r.maxSize >= 0)) throw new Error('certify: maxSize must be an integer ≥ 0')
  if (!(r.singularCondition > 1)) throw new Error('certify: singularCondition must exceed 1')
  if (!(Number.isInteger(r.bisectionSteps) && r.bisectionSteps >= 0)) throw new Error('certify: bisectionSteps must be an integer ≥ 0')
  if (!(r.minRadius >= 0)) throw new Error('certify: minRadius must be ≥ 0')
  return r
}

/** Triplet indices grouped by column (or row): start[j] .. start[j+1] into order. */
function groupBy(keys: Int32Array, count: number, n: number): { start: Int32Array; order: Int32Array } {
  const start = new Int32Array(n + 1)
  for (let t = 0; t < count; t++) start[keys[t]! + 1]!++
  for (let j = 0; j < n; j++) start[j + 1]! += start[j]!
  const fill = start.slice(0, n)
  const order = new Int32Array(count)
  for (let t = 0; t < count; t++) order[fill[keys[t]!]!++] = t
  return { start, order }
}

/** Midpoints of an interval triplet matrix (the float Jacobian J̃). */
function midpoints(A: IntervalTriplets): Float64Array {
  const m = new Float64Array(A.count)
  for (let t = 0; t < A.count; t++) m[t] = Math.min(A.hi[t]!, Math.max(A.lo[t]!, 0.5 * A.lo[t]! + 0.5 * A.hi[t]!))
  return m
}

/** C = J̃⁻¹, column-major (C[i, j] at c[j·n + i]), or the reason there is none. */
function approximateInverse(A: IntervalTriplets, mid: Float64Array, symmetric: boolean): { ok: true; c: Float64Array } | { ok: false; reason: string } {
  const n = A.nRows
  const t = new TripletBuilder(n, n, A.count)
  for (let k = 0; k < A.count; k++) t.add(A.rows[k]!, A.cols[k]!, mid[k]!)
  const f = new SparseSolver().factor(t.build(), symmetric)
  if (!f.ok) return { ok: false, reason: f.reason }
  const c = new Float64Array(n * n)
  const e = new Float64Array(n), col = new Float64Array(n)
  for (let j = 0; j < n; j++) {
    e[j] = 1
    f.factor.solve(e, col)
    e[j] = 0
    for (let i = 0; i < n; i++) {
      if (!Number.isFinite(col[i]!)) return { ok: false, reason: 'the Jacobian is singular (non-finite inverse)' }
      c[j * n + i] = col[i]!
    }
  }
  return { ok: true, c }
}

/** Componentwise upper bounds z0[i] ≥ Σ_j |(I − C J̃)_ij|. */
function identityDefect(c: Float64Array, A: IntervalTriplets, mid: Float64Array): Float64Array {
  const n = A.nRows
  const { start, order } = groupBy(A.cols, A.count, n)
  const z0 = new Float64Array(n), s = new Float64Array(n), a = new Float64Array(n)
  for (let j = 0; j < n; j++) {
    s.fill(0); a.fill(0)
    const m = start[j + 1]! - start[j]!
    for (let q = start[j]!; q < start[j + 1]!; q++) {
      const t = order[q]!, k = A.rows[t]!, v = mid[t]!, off = k * n
      for (let i = 0; i < n; i++) {
        const p = c[off + i]! * v
        s[i]! += p
        a[i]! += Math.abs(p)
      }
    }
    const g = gamma(2 * m + 2), under = (m + 1) * UNDERFLOW_PER_TERM
    for (let i = 0; i < n; i++) {
      const d = (i === j ? 1 : 0) - s[i]!
      const err = succ(g * succ(a[i]! + Math.abs(d)) + under)
      z0[i] = succ(z0[i]! + succ(Math.abs(d) + err))
    }
  }
  return z0
}

/** y[i] ≥ |(C F)_i| for F in [flo, fhi]. */
function defectBound(c: Float64Array, n: number, flo: Float64Array, fhi: Float64Array): Float64Array {
  const s = new Float64Array(n), a = new Float64Array(n), b = new Float64Array(n)
  for (let j = 0; j < n; j++) {
    const fm = Math.min(fhi[j]!, Math.max(flo[j]!, 0.5 * flo[j]! + 0.5 * fhi[j]!))
    const fr = succ(Math.max(fhi[j]! - fm, fm - flo[j]!))
    const off = j * n
    for (let i = 0; i < n; i++) {
      const cij = c[off + i]!, p = cij * fm
      s[i]! += p; a[i]! += Math.abs(p); b[i]! += Math.abs(cij) * fr
    }
  }
  const g = gamma(2 * n + 2), under = (n + 1) * UNDERFLOW_PER_TERM
  const y = new Float64Array(n)
  for (let i = 0; i < n; i++) {
    y[i] = succ(succ(Math.abs(s[i]!) + succ(g * succ(a[i]! + Math.abs(s[i]!)))) + succ(b[i]! * succ(1 + g)) + under)
  }
  return y
}

/** Evaluates the radii polynomial at r: true when maxᵢ yᵢ + Zᵢ(r)·r < r is proven. */
class RadiiPolynomial {
  readonly absC: Float64Array
  private readonly g: number
  evaluations = 0
  constructor(private sys: IntervalSystem, private x: Float64Array, c: Float64Array, private mid: Float64Array,
    private z0: Float64Array, private y: Float64Array) {
    this.absC = c.map(Math.abs)
    this.g = gamma(2 * sys.n + 2)
  }

  /** Upper bound of maxᵢ (yᵢ + Zᵢ(r)·r) − r < 0, and the Z(r) seen. */
  check(r: number): { ok: boolean; z: number } {
    this.evaluations++
    const n = this.sys.n, lo = new Float64Array(n), hi = new Float64Array(n)
    for (let i = 0; i < n; i++) { lo[i] = pred(this.x[i]! - r); hi[i] = succ(this.x[i]! + r) }
    const A = this.sys.jacobianEnclosure(lo, hi)
    const rho = new Float64Array(n)
    for (let t = 0; t < A.count; t++) {
      const m = this.mid[t]!
      const dev = Math.max(succ(A.hi[t]! - m), succ(m - A.lo[t]!))
      rho[A.rows[t]!] = succ(rho[A.rows[t]!]! + dev)
    }
    const w = new Float64Array(n)
    for (let k = 0; k < n; k++) {
      const rk = rho[k]!
      if (rk === 0) continue
      const off = k * n
      for (let i = 0; i < n; i++) w[i]! += this.absC[off + i]! * rk
    }
    let worst = -Infinity, zMax = 0
    for (let i = 0; i < n; i++) {
      const z = succ(this.z0[i]! + succ(succ(w[i]! * succ(1 + this.g)) + n * UNDERFLOW_PER_TERM))
      zMax = Math.max(zMax, z)
      worst = Math.max(worst, succ(this.y[i]! + succ(z * r)))
    }
    return { ok: worst < r, z: Number.isNaN(zMax) ? Infinity : zMax }
  }
}

/** ‖M‖∞ of a triplet matrix given by values (float estimate, for the condition check only). */
function rowSumNorm(A: IntervalTriplets, values: Float64Array): number {
  const r = new Float64Array(A.nRows)
  for (let t = 0; t < A.count; t++) r[A.rows[t]!]! += Math.abs(values[t]!)
  return r.reduce((m, v) => Math.max(m, v), 0)
}

/** The data every radius check shares, or a certificate that ends the work early. */
function prepare(sys: IntervalSystem, x: Float64Array, o: Required<CertifyOptions>):
  { done: ZeroCertificate } | { poly: RadiiPolynomial; Y: number; Z0: number; condition: number } {
  const n = sys.n
  if (x.length !== n) throw new Error(`certify: x has length ${x.length}, expected ${n}`)
  if (n > o.maxSize) return { done: { certified: false, size: n, reason: 'too-large', detail: `${n} unknowns, more than the ${o.maxSize} certified within 10 s on the reference machine` } }
  if (!x.every(Number.isFinite)) return { done: { certified: false, size: n, reason: 'enclosure-too-wide', detail: 'the point has a non-finite coordinate' } }
  if (n === 0) return { done: { certified: true, size: 0, rMin: 0, rMax: Infinity, y: 0, z0: 0, norm: 'max' } }
  const A0 = sys.jacobianEnclosure(x, x)
  const mid = midpoints(A0)
  const inv = approximateInverse(A0, mid, o.symmetric)
  if (!inv.ok) return { done: { certified: false, size: n, reason: 'not-rigid', detail: `the Jacobian at the point is singular: ${inv.reason}` } }
  const c = inv.c
  const z0 = identityDefect(c, A0, mid)
  const f = sys.residualEnclosure(x)
  const y = defectBound(c, n, f.lo, f.hi)
  const Y = y.reduce((m, v) => Math.max(m, v), 0), Z0 = z0.reduce((m, v) => Math.max(m, v), 0)
  const poly = new RadiiPolynomial(sys, x, c, mid, z0, y)
  let cNorm = 0
  for (let i = 0; i < n; i++) { let s = 0; for (let j = 0; j < n; j++) s += poly.absC[j * n + i]!; cNorm = Math.max(cNorm, s) }
  return { poly, Y, Z0, condition: cNorm * Math.max(rowSumNorm(A0, mid), sys.jacobianScale ?? 0) }
}

/** Proves (or fails to prove) a unique zero of `sys` near x (radii in the max-norm). */
export function certifyZero(sys: IntervalSystem, x: Float64Array, options?: CertifyOptions): ZeroCertificate {
  const o = resolveCertifyOptions(options)
  const n = sys.n
  const prep = prepare(sys, x, o)
  if ('done' in prep) return prep.done
  const { poly, Y, Z0, condition } = prep
  const fail = (why: string): ZeroCertificate => condition > o.singularCondition
    ? { certified: false, size: n, reason: 'not-rigid', detail: `the Jacobian is singular to working precision (condition ≈ ${condition.toExponential(1)}); ${why}` }
    : { certified: false, size: n, reason: 'enclosure-too-wide', detail: why }
  if (!(Z0 < 1)) return fail(`‖I − C F'(x̃)‖∞ ≤ ${Z0.toExponential(2)} is not below 1`)
  // smallest radius: r = Y / (1 − Z(r)), a few fixed-point steps with 5 % head-room
  const cap = sys.maxRadius(x)
  let r = Math.max(o.minRadius, succ(1.05 * Y / (1 - Z0))), rMin = NaN
  for (let k = 0; k < 8 && Number.isNaN(rMin); k++) {
    if (!(r <= cap)) break
    const { ok, z } = poly.check(r)
    if (ok) rMin = r
    else if (z < 1) r = Math.max(succ(1.05 * Y / (1 - z)), 2 * r)
    else break
  }
  if (Number.isNaN(rMin)) return fail(`no radius r with Y + Z(r)·r < r (Y ≤ ${Y.toExponential(2)}, Z₀ ≤ ${Z0.toExponential(2)})`)
  // largest radius: grow by 4, then bisect geometrically between the last success and the first failure
  let good = rMin, bad = Infinity
  while (bad === Infinity) {
    const next = Math.min(4 * good, cap)
    if (next <= good) break
    if (poly.check(next).ok) { good = next; if (next === cap) break } else bad = next
  }
  for (let k = 0; k < o.bisectionSteps && bad < Infinity && bad / good > 1.02; k++) {
    const m = Math.sqrt(good * bad)
    if (poly.check(m).ok) good = m
    else bad = m
  }
  return { certified: true, size: n, rMin, rMax: good, y: Y, z0: Z0, norm: 'max' }
}

/**
 * Re-proves a claimed certificate: true only when p(r) < 0 is proven here for both claimed radii
 * (a unique zero within rMin of x, and no other within rMax). The server runs this on what a
 * client submits, so a claim is never taken on trust and different engines need not agree bit
 * for bit.
 */
export function proveClaim(sys: IntervalSystem, x: Float64Array, rMin: number, rMax: number, options?: CertifyOptions): boolean {
  if (!(rMin > 0 && rMax >= rMin && Number.isFinite(rMax))) return sys.n === 0 && rMin === 0
  if (!(rMax <= sys.maxRadius(x))) return false
  const prep = prepare(sys, x, resolveCertifyOptions(options))
  if ('done' in prep) return prep.done.certified && sys.n === 0
  return prep.poly.check(rMin).ok && (rMax === rMin || prep.poly.check(rMax).ok)
}
