import { describe, expect, it } from 'vitest'
import { runContinuation, switchBranch } from '../../../shared/continuation'
import { scalarProblem } from './problems'

// Normal forms of the elementary bifurcations (classical; e.g. Yu. A. Kuznetsov, Elements of
// Applied Bifurcation Theory, 3rd ed. 2004, §3.3 and §10.2 — from memory).
describe('normal forms', () => {
  it('fold x² + λ = 0 located at (0, 0)', () => {
    const p = scalarProblem((x, l) => x * x + l, (x) => 2 * x, () => 1)
    const r = runContinuation(p, { u: [-1], lambda: -1 }, { maxPoints: 60, lambdaMin: -1.5 })
    expect(r.started).toBe(true)
    const folds = r.specialPoints.filter((s) => s.kind === 'fold')
    expect(folds).toHaveLength(1)
    const f = folds[0]!
    console.log('fold x²+λ: λ =', f.lambda, 'x =', f.u[0], 'precision', f.precision)
    expect(Math.abs(f.lambda)).toBeLessThan(1e-9)
    expect(Math.abs(f.u[0]!)).toBeLessThan(1e-6)
    expect(f.located).toBe(true)
    expect(r.specialPoints.some((s) => s.kind === 'branch point')).toBe(false)
    // every stored point satisfies λ = −x²
    for (const q of r.points) expect(Math.abs(q.lambda + q.u[0]! ** 2)).toBeLessThan(1e-9)
    expect(r.finishReason).toMatch(/bound/)
  })

  for (const [name, f, fx, other] of [
    ['pitchfork λx − x³', (x: number, l: number) => l * x - x ** 3, (x: number, l: number) => l - 3 * x * x, (x: number, l: number) => x * x - l],
    ['transcritical λx − x²', (x: number, l: number) => l * x - x * x, (x: number, l: number) => l - 2 * x, (x: number, l: number) => x - l],
  ] as const) {
    it(`${name}: branch point at the origin, switching onto the other branch`, () => {
      const p = scalarProblem(f, fx, (x) => x)
      const r = runContinuation(p, { u: [0], lambda: -1 }, { lambdaMax: 1 })
      const bps = r.specialPoints.filter((s) => s.kind === 'branch point')
      expect(bps).toHaveLength(1)
      const bp = bps[0]!
      console.log(`${name}: branch point λ = ${bp.lambda}, x = ${bp.u[0]}, kernel ${bp.kernel}`)
      expect(Math.abs(bp.lambda)).toBeLessThan(1e-9)
      expect(Math.abs(bp.kernel![0]!)).toBeGreaterThan(0.99) // the other branch leaves along x
      const c = switchBranch(p, r, bp.index, { maxPoints: 15 })
      while (!c.done) c.next()
      const nb = c.result()
      expect(nb.started).toBe(true)
      expect(nb.branch.parent).toEqual({ branchId: 'branch-1', specialPointIndex: bp.index })
      expect(nb.points.length).toBeGreaterThan(5)
      let maxDev = 0
      for (const q of nb.points) maxDev = Math.max(maxDev, Math.abs(other(q.u[0]!, q.lambda)))
      console.log(`${name}: new branch max |other-branch equation| = ${maxDev}`)
      expect(maxDev).toBeLessThan(1e-9)
      expect(Math.max(...nb.points.map((q) => Math.abs(q.u[0]!)))).toBeGreaterThan(0.1)
    })
  }
})
