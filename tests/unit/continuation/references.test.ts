import { describe, expect, it } from 'vitest'
import { TripletBuilder } from '../../../shared/linalg/triplets'
import type { ContinuationProblem } from '../../../shared/continuation'
import { runContinuation } from '../../../shared/continuation'
import { scalarProblem, twistedRing } from './problems'

describe('two-node sine coupling', () => {
  // P = (V1 V2 / X) sin δ has its transfer limit (a fold in P) at δ = 90°
  // (P. Kundur, Power System Stability and Control, McGraw-Hill 1994).
  it('fold at δ = 90° with P = V1 V2 / X', () => {
    const V1 = 1.05, V2 = 1.0, X = 0.5, k = V1 * V2 / X
    const p = scalarProblem((d, P) => P - k * Math.sin(d), (d) => -k * Math.cos(d), () => 1)
    const r = runContinuation(p, { u: [0], lambda: 0 }, { stopAtSpecialPoint: true })
    const f = r.specialPoints.find((s) => s.kind === 'fold')!
    console.log(`two-node: fold δ = ${f.u[0]} (π/2 = ${Math.PI / 2}, deviation ${(f.u[0]! - Math.PI / 2).toExponential(2)}), P = ${f.lambda} (deviation ${(f.lambda - k).toExponential(2)})`)
    expect(Math.abs(f.u[0]! - Math.PI / 2)).toBeLessThan(1e-7)
    expect(Math.abs(f.lambda - k)).toBeLessThan(1e-12)
  })
})

describe('cusp normal form μ + λx − x³', () => {
  // Folds satisfy μ + λx − x³ = 0 and λ − 3x² = 0, hence 27μ² = 4λ³ (derived; classical cusp normal form).
  for (const mu of [0.1, 0.5, -0.3]) {
    it(`μ = ${mu}: fold on the 27μ² = 4λ³ curve`, () => {
      const p = scalarProblem((x, l) => mu + l * x - x ** 3, (x, l) => l - 3 * x * x, (x) => x)
      // start on the component that folds: sign(x) = −sign(μ), λ = x² − μ/x
      const x0 = -2 * Math.sign(mu)
      const r = runContinuation(p, { u: [x0], lambda: x0 * x0 - mu / x0 }, { direction: 'decrease', stopAtSpecialPoint: true })
      const f = r.specialPoints.find((s) => s.kind === 'fold')!
      const lc = 3 * Math.cbrt(mu * mu / 4)
      console.log(`cusp μ=${mu}: fold λ = ${f.lambda}, (4λ³/27)^(1/2) − |μ| = ${(Math.sqrt(4 * f.lambda ** 3 / 27) - Math.abs(mu)).toExponential(2)}, λ − 3(μ²/4)^(1/3) = ${(f.lambda - lc).toExponential(2)}`)
      expect(Math.abs(27 * mu * mu - 4 * f.lambda ** 3)).toBeLessThan(1e-9)
    })
  }
})

describe('twisted states on a ring: rigidity loss that no determinant sign sees', () => {
  // Twisted state with phase difference θ on every edge has Jacobian weights cos θ; it becomes
  // singular where cos θ = 0 (D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync basin",
  // Chaos 16, 015103, 2006). Here θ = α/m, so for m = 5 all m−1 = 4 reduced eigenvalues cross zero
  // together at α = 5π/2: an EVEN crossing (derived from that Jacobian).
  it('m = 5: rigidity loss at α = 5π/2, no fold, no branch point', () => {
    const m = 5
    const p = twistedRing(m)
    const r = runContinuation(p, { u: [1, 2, 3, 4].map((j) => (j * 6) / m), lambda: 6 }, { lambdaMax: 9, maxStep: 0.3 })
    const kinds = r.specialPoints.map((s) => s.kind)
    expect(kinds).toEqual(['rigidity loss', 'bound'])
    const s = r.specialPoints[0]!
    const exact = (5 * Math.PI) / 2
    console.log(`twisted ring: rigidity loss at α = ${s.lambda}, 5π/2 = ${exact}, relative deviation ${((s.lambda - exact) / exact).toExponential(2)}; inertia ${r.points[0]!.tests.negativeEigenvalues} → ${r.points.at(-1)!.tests.negativeEigenvalues}`)
    expect(Math.abs(s.lambda - exact) / exact).toBeLessThan(1e-9)
    expect(s.located).toBe(true)
    // G = Σ sin φ gives F_u = −(Laplacian with weights cos φ): negative definite before the crossing
    expect(r.points[0]!.tests.negativeEigenvalues).toBe(4)
    expect(r.points.at(-1)!.tests.negativeEigenvalues).toBe(0)
    // the bordered determinant sign is the same on both sides: the crossing is invisible to it
    expect(r.points[0]!.tests.borderedDetSign).toBe(r.points.at(-1)!.tests.borderedDetSign)
    // σ_min(F_u) = |cos(α/m)| · (2 − 2cos(π/m)): with ψ_0 pinned, the reduced Laplacian of the ring is
    // the (m−1)×(m−1) tridiagonal Toeplitz matrix (2, −1), eigenvalues 2 − 2cos(kπ/m) (common practice).
    let worst = 0
    for (const q of r.points) {
      const exactSigma = Math.abs(Math.cos(q.lambda / m)) * (2 - 2 * Math.cos(Math.PI / m))
      worst = Math.max(worst, Math.abs(q.sigmaMin! - exactSigma) / exactSigma)
    }
    console.log(`twisted ring: σ_min estimate (default inverse-iteration steps) max relative deviation ${worst.toExponential(2)}`)
    expect(worst).toBeLessThan(1e-2)
  })
})

describe('unsymmetric system with a fold, and the dense solver path', () => {
  // F = (x² + λ + y/2, 3y − x): y = x/3, λ = −x² − x/6, fold at x = −1/12, λ = 1/144 (derived).
  const problem: ContinuationProblem = {
    n: 2,
    residual: (u, l, out) => { out[0] = u[0]! ** 2 + l + u[1]! / 2; out[1] = 3 * u[1]! - u[0]! },
    jacobian: (u) => {
      const b = new TripletBuilder(2, 2)
      b.add(0, 0, 2 * u[0]!); b.add(0, 1, 0.5); b.add(1, 0, -1); b.add(1, 1, 3)
      return { Fu: b.build(), Flambda: Float64Array.of(1, 0) }
    },
  }
  for (const method of ['auto', 'dense'] as const) {
    it(`fold at x = −1/12, λ = 1/144 (solver ${method})`, () => {
      const r = runContinuation(problem, { u: [-1, -1 / 3], lambda: -1 + 1 / 6 }, { stopAtSpecialPoint: true, solver: { method } })
      const f = r.specialPoints[0]!
      expect(f.kind).toBe('fold')
      console.log(`unsymmetric fold (${method}): x deviation ${(f.u[0]! + 1 / 12).toExponential(2)}, λ deviation ${(f.lambda - 1 / 144).toExponential(2)}`)
      expect(Math.abs(f.u[0]! + 1 / 12)).toBeLessThan(1e-8)
      expect(Math.abs(f.u[1]! + 1 / 36)).toBeLessThan(1e-8)
      expect(Math.abs(f.lambda - 1 / 144)).toBeLessThan(1e-12)
    })
  }
})
