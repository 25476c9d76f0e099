import { TripletBuilder } from '../../../shared/linalg/triplets'
import type { ContinuationProblem, ProblemEvent } from '../../../shared/continuation'

/** One equation f(x, λ) = 0 in one unknown, with its analytic derivatives. */
export function scalarProblem(f: (x: number, l: number) => number, fx: (x: number, l: number) => number, fl: (x: number, l: number) => number, events?: ProblemEvent[]): ContinuationProblem {
  return {
    n: 1,
    symmetric: true,
    events,
    residual: (u, l, out) => { out[0] = f(u[0]!, l) },
    jacobian: (u, l) => {
      const b = new TripletBuilder(1, 1, 1)
      b.add(0, 0, fx(u[0]!, l))
      return { Fu: b.build(), Flambda: Float64Array.of(fl(u[0]!, l)) }
    },
  }
}

/**
 * Bratu problem u'' + λ eᵘ = 0 on (0, 1), u(0) = u(1) = 0, 3-point differences on N interior
 * points, h = 1/(N+1): (u_{i−1} − 2u_i + u_{i+1})/h² + λ e^{u_i} = 0.
 */
export function bratu(N: number): ContinuationProblem {
  const h2 = 1 / ((N + 1) * (N + 1))
  return {
    n: N,
    symmetric: true,
    residual(u, l, out) {
      for (let i = 0; i < N; i++) {
        const left = i > 0 ? u[i - 1]! : 0, right = i < N - 1 ? u[i + 1]! : 0
        out[i] = (left - 2 * u[i]! + right) / h2 + l * Math.exp(u[i]!)
      }
    },
    jacobian(u, l) {
      const b = new TripletBuilder(N, N, 3 * N)
      const Fl = new Float64Array(N)
      for (let i = 0; i < N; i++) {
        if (i > 0) b.add(i, i - 1, 1 / h2)
        b.add(i, i, -2 / h2 + l * Math.exp(u[i]!))
        if (i < N - 1) b.add(i, i + 1, 1 / h2)
        Fl[i] = Math.exp(u[i]!)
      }
      return { Fu: b.build(), Flambda: Fl }
    },
  }
}

/**
 * The fold of the discrete Bratu problem by shooting, independent of the continuation engine
 * (derived): a solution is fixed by its first value a = u_1, since the scheme gives
 * u_{i+1} = 2u_i − u_{i−1} − h²λ e^{u_i} from u_0 = 0; for each a, λ(a) is the root of
 * u_{N+1}(a, λ) = 0 (bisection on λ ∈ [0, 4]: u_{N+1} = (N+1)a > 0 at λ = 0), and the fold is the
 * largest λ(a) (golden-section search over a; the branch of solutions is one arc in a).
 */
export function bratuFoldByShooting(N: number): number {
  const h2 = 1 / ((N + 1) * (N + 1))
  const end = (a: number, l: number) => {
    let prev = 0, cur = a
    for (let i = 1; i <= N; i++) {
      const next = 2 * cur - prev - h2 * l * Math.exp(cur)
      prev = cur; cur = next
      if (cur < -50) return -1 // fell through: the end value is negative
    }
    return cur
  }
  const lambdaOf = (a: number) => {
    let lo = 0, hi = 4
    for (let k = 0; k < 100 && hi - lo > 1e-15; k++) {
      const mid = (lo + hi) / 2
      if (end(a, mid) > 0) lo = mid; else hi = mid
    }
    return (lo + hi) / 2
  }
  // the continuous fold has u'(0) ≈ 4, so a = u_1 ≈ 4h: search a/h in [0.5, 12]
  const h = 1 / (N + 1)
  let x0 = 0.5 * h, x1 = 12 * h
  const g = (Math.sqrt(5) - 1) / 2
  let c = x1 - g * (x1 - x0), d = x0 + g * (x1 - x0), fc = lambdaOf(c), fd = lambdaOf(d)
  for (let k = 0; k < 80; k++) {
    if (fc > fd) { x1 = d; d = c; fd = fc; c = x1 - g * (x1 - x0); fc = lambdaOf(c) }
    else { x0 = c; c = d; fc = fd; d = x0 + g * (x1 - x0); fd = lambdaOf(d) }
  }
  return Math.max(fc, fd)
}

/**
 * Ring of m identical phase oscillators with sine coupling; the closing edge (m−1 → 0) carries the
 * period phase λ = α. Unknowns ψ_1..ψ_{m−1} (ψ_0 = 0 pinned), equations G(v) = Σ sin φ_h for
 * v = 1..m−1 (G(0) is redundant). Twisted state ψ_j = jα/m: every phase difference is α/m.
 */
export function twistedRing(m: number): ContinuationProblem {
  const n = m - 1
  const phase = (u: Float64Array, j: number): number => (j === 0 ? 0 : u[j - 1]!)
  // phase difference along edge j → j+1 (mod m), with the shift α on the closing edge
  const diff = (u: Float64Array, l: number, j: number): number => phase(u, (j + 1) % m) - phase(u, j) + (j === m - 1 ? l : 0)
  return {
    n,
    symmetric: true,
    residual(u, l, out) {
      for (let v = 1; v < m; v++) out[v - 1] = Math.sin(diff(u, l, v)) - Math.sin(diff(u, l, v - 1))
    },
    jacobian(u, l) {
      const b = new TripletBuilder(n, n, 3 * n)
      const Fl = new Float64Array(n)
      for (let v = 1; v < m; v++) {
        const cOut = Math.cos(diff(u, l, v)), cIn = Math.cos(diff(u, l, v - 1))
        // ∂/∂ψ_v of sin(ψ_{v+1} − ψ_v) − sin(ψ_v − ψ_{v−1})
        b.add(v - 1, v - 1, -cOut - cIn)
        if (v + 1 < m) b.add(v - 1, v, cOut)
        if (v - 1 >= 1) b.add(v - 1, v - 2, cIn)
        if (v === m - 1) Fl[v - 1] = cOut
      }
      return { Fu: b.build(), Flambda: Fl }
    },
  }
}
