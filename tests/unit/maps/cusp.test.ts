/**
 * The minimally augmented rigidity-loss system on the cusp normal form F = μ + λx − x³:
 * F = F_x = 0 gives λ = 3x², μ = −2x³, hence 27μ² = 4λ³ (derived; classical cusp catastrophe).
 */
import { describe, expect, it } from 'vitest'
import { TripletBuilder } from '../../../shared/linalg/triplets'
import { augmentedTest, nullVectors, rigidityLossCurveProblem, traceCurve, type TwoParameterProblem } from '../../../shared/maps'

// parameters: a = μ, b = λ
const cusp: TwoParameterProblem = {
  n: 1,
  residual: (u, mu, lam, out) => { out[0] = mu + lam * u[0]! - u[0]! ** 3 },
  jacobianU: (u, _mu, lam) => { const t = new TripletBuilder(1, 1, 1); t.add(0, 0, lam - 3 * u[0]! ** 2); return t.build() },
}

describe('cusp normal form traced in two parameters', () => {
  it('the test function vanishes exactly where F_x does', () => {
    const b = Float64Array.of(1)
    expect(Math.abs(augmentedTest(cusp, Float64Array.of(1), -2, 3, b, b))).toBeLessThan(1e-15)
    expect(Math.abs(augmentedTest(cusp, Float64Array.of(1), -2, 3.5, b, b))).toBeGreaterThan(0.1)
  })

  it('follows 27μ² = 4λ³ through the cusp point', () => {
    const x0 = 1.2
    const u0 = Float64Array.of(x0)
    const nv = nullVectors(cusp, u0, -2 * x0 ** 3, 3 * x0 ** 2)
    const curve = traceCurve('rigidity loss', rigidityLossCurveProblem(cusp, nv.right, nv.left), Float64Array.of(x0, 3 * x0 ** 2), -2 * x0 ** 3,
      { aMin: -4, aMax: 4, bMin: -1, bMax: 5, maxStep: 0.05 })
    expect(curve.converged).toBe(true)
    expect(curve.maxResidual).toBeLessThan(1e-10)
    const mus = curve.points.map(p => p[0])
    // both branches of the cusp are reached: μ of both signs
    expect(Math.min(...mus)).toBeLessThan(-1)
    expect(Math.max(...mus)).toBeGreaterThan(1)
    for (const [mu, lam] of curve.points) expect(Math.abs(27 * mu * mu - 4 * lam ** 3)).toBeLessThan(1e-8 * (1 + 4 * Math.abs(lam) ** 3))
  })
})
