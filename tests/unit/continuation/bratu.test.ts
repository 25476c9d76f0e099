import { describe, expect, it } from 'vitest'
import { runContinuation } from '../../../shared/continuation'
import { bratu, bratuFoldByShooting } from './problems'

/**
 * The fold of u'' + λ eᵘ = 0, u(0) = u(1) = 0 (G. Bratu, "Sur les équations intégrales non
 * linéaires", Bull. Soc. Math. France 42, 1914, from memory): the
 * solutions are u = −2 ln[cosh(θ(x − ½)/2) / cosh(θ/4)] with λ = θ²/(2 cosh²(θ/4)); λ is largest
 * where dλ/dθ = 0, i.e. x tanh x = 1 with x = θ/4, giving λ* = 8x²/cosh²x (derived). Solved here by
 * Newton.
 */
function analyticBratuFold(): number {
  let x = 1.2
  for (let k = 0; k < 50; k++) x -= (x * Math.tanh(x) - 1) / (Math.tanh(x) + x / Math.cosh(x) ** 2)
  return 8 * x * x / Math.cosh(x) ** 2
}

function discreteFold(N: number): { lambda: number; located: boolean; precision: number; points: number } {
  const r = runContinuation(bratu(N), { u: new Array(N).fill(0), lambda: 0 }, { maxStep: 2, initialStep: 0.1, stopAtSpecialPoint: true, maxPoints: 400 })
  const f = r.specialPoints.find((s) => s.kind === 'fold')
  if (!f) throw new Error(`no fold found for N = ${N}: ${r.finishReason}`)
  return { lambda: f.lambda, located: f.located, precision: f.precision, points: r.points.length }
}

describe('Bratu problem, 3-point finite differences', () => {
  // Discrete fold values by shooting on the same scheme (bratuFoldByShooting, derived), a method
  // that shares nothing with the continuation engine.
  const found = new Map<number, number>()
  for (const N of [10, 100, 1000]) {
    it(`N = ${N}: fold where shooting puts the largest λ (to 1e-9)`, () => {
      const ref = bratuFoldByShooting(N)
      const f = discreteFold(N)
      found.set(N, f.lambda)
      console.log(`Bratu N=${N}: fold λ = ${f.lambda.toFixed(10)}, ref ${ref}, deviation ${(f.lambda - ref).toExponential(2)}, precision ${f.precision.toExponential(1)}, points ${f.points}`)
      expect(f.located).toBe(true)
      expect(Math.abs(f.lambda - ref)).toBeLessThan(1e-9)
    })
  }

  it('the discrete folds approach the analytic λ* (x tanh x = 1) as h²', () => {
    const lim = analyticBratuFold()
    // λ* is the largest λ(θ) = θ²/(2 cosh²(θ/4)) of the closed-form solutions (derived above)
    const lambdaOf = (t: number) => t * t / (2 * Math.cosh(t / 4) ** 2)
    let best = 0
    for (let t = 0.5; t < 12; t += 1e-4) best = Math.max(best, lambdaOf(t))
    console.log(`Bratu analytic limit λ* = ${lim}, largest λ(θ) on a 1e-4 grid ${best}`)
    expect(lim).toBeGreaterThanOrEqual(best)
    expect(lim - best).toBeLessThan(1e-8)
    // 3-point differences are second order (common practice), so (λ* − λ_c(h))/h² tends to one
    // constant: the three grids must agree on it to a few per cent
    const coefs = [10, 100, 1000].map((N) => {
      const lam = found.get(N) ?? discreteFold(N).lambda
      const h = 1 / (N + 1)
      return (lim - lam) / (h * h)
    })
    console.log(`Bratu (λ* − λ_c(h))/h² for N = 10, 100, 1000: ${coefs.map(c => c.toFixed(4)).join(', ')}`)
    for (const c of coefs) expect(c).toBeGreaterThan(0)
    expect(Math.abs(coefs[1]! - coefs[2]!) / coefs[2]!).toBeLessThan(1e-3)
    expect(Math.abs(coefs[0]! - coefs[2]!) / coefs[2]!).toBeLessThan(2e-2)
  })
})
