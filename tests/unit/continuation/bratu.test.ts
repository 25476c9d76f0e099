import { describe, expect, it } from 'vitest'
import { runContinuation } from '../../../shared/continuation'
import { bratu } from './problems'

/** λ* = 8x²/cosh²x with x tanh x = 1, solved here by Newton (Bratu/Gelfand; closed form from memory). */
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
  // Discrete fold values and the limit λ* = 3.51383071912516 (λ* = 8x²/cosh²x with x tanh x = 1,
  // docs/theory.md §8); the discrete values are from memory (R. Buckmire and the Bratu/Gelfand
  // literature), not re-derived.
  const refs = [[10, 3.4986839], [100, 3.5136515], [1000, 3.5138289]] as const
  const found = new Map<number, number>()
  for (const [N, ref] of refs) {
    it(`N = ${N}: fold at λ ≈ ${ref} (to 1e-6)`, () => {
      const f = discreteFold(N)
      found.set(N, f.lambda)
      console.log(`Bratu N=${N}: fold λ = ${f.lambda.toFixed(10)}, ref ${ref}, deviation ${(f.lambda - ref).toExponential(2)}, precision ${f.precision.toExponential(1)}, points ${f.points}`)
      expect(f.located).toBe(true)
      expect(Math.abs(f.lambda - ref)).toBeLessThan(1e-6)
    })
  }

  it('the analytic limit (x tanh x = 1) is 3.51383071912516 and the discrete folds approach it as h²', () => {
    const lim = analyticBratuFold()
    console.log(`Bratu analytic limit λ* = ${lim}, deviation from 3.51383071912516: ${(lim - 3.51383071912516).toExponential(2)}`)
    expect(Math.abs(lim - 3.51383071912516)).toBeLessThan(1e-13)
    // λ_c(h) ≈ λ* − 1.828 h² (coefficient from memory, same literature).
    for (const N of [10, 100, 1000]) {
      const lam = found.get(N) ?? discreteFold(N).lambda
      const h = 1 / (N + 1)
      const coef = (lim - lam) / (h * h)
      console.log(`Bratu N=${N}: (λ* − λ_c(h))/h² = ${coef.toFixed(4)} (expected ≈ 1.828)`)
      expect(Math.abs(coef - 1.828)).toBeLessThan(0.02)
    }
  })
})
