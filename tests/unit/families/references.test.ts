/**
 * Families against outside references: the Fermat–Torricelli collapse of the two-vertex
 * three-edge torus pattern under shear, the rigidity loss of twisted ring states in α1, and the
 * wing rotation of the plane bridge against its closed form.
 */
import { describe, expect, it } from 'vitest'
import { FamilyRunner } from '../../../shared/families'
import type { FamilySettingsInput } from '../../../shared/types/family'
import type { PatternDocument } from '../../../shared/types/pattern'
import { BRIDGE_WINGS, fermatPair, planeBridge, ring } from './fixtures'

function runToEnd(doc: PatternDocument, settings: FamilySettingsInput) {
  const r = new FamilyRunner(doc, settings)
  while (!r.done) r.step({ points: 1000, ms: 60_000 })
  return r.result()
}

describe('Fermat pair sheared in a (ω1 = (1, 0), ω2 = (a, 1))', () => {
  // Fermat–Torricelli: the point minimising the distances to the corners of a triangle sees every
  // side under 120° while all angles are < 120°, and sits at the corner once an angle reaches 120°
  // (first isogonic centre X(13), C. Kimberling, Encyclopedia of Triangle Centers). Balance of the
  // free vertex is exactly that point in the triangle (0, ω1, ω2), so an edge collapses when an
  // angle reaches 120°. Angle at 0: cos = a/√(1+a²) = −1/2 ⇔ a = −1/√3. The reflection
  // x ↦ 1 − x maps the triangle for a to the one for 1 − a and swaps the corners 0 and ω1, so the
  // angle at ω1 reaches 120° at a = 1 + 1/√3 (derived here); the angle at ω2 has
  // cos ∝ a² − a + 1 > 0, it never exceeds 90°.
  const tol = 1e-8
  const cases = [
    { to: -2, exact: -1 / Math.sqrt(3), edge: 'angle at the origin' },
    { to: 3, exact: 1 + 1 / Math.sqrt(3), edge: 'angle at ω1' },
  ]
  for (const c of cases) {
    it(`collapses where the ${c.edge} reaches 120° (a = ${c.exact.toFixed(6)})`, () => {
      const r = runToEnd(fermatPair(0), { path: { kind: 'shear' }, to: c.to, stop: { collapseTolerance: tol } })
      expect(r.status).toBe('finished')
      const kinds = r.branch.specialPoints.map(s => s.kind)
      expect(kinds).toEqual(['collapse'])
      const s = r.branch.specialPoints[0]!
      const dev = Math.abs(s.lambda - c.exact)
      console.log(`fermat shear: collapse at a = ${s.lambda}, exact ${c.exact}, deviation ${dev.toExponential(2)} (collapse tolerance ${tol} of the mean length)`)
      // the collapsing length is linear in a − a* near the collapse, so the event lies O(tol) early
      expect(dev).toBeLessThan(10 * tol)
      expect(s.located).toBe(true)
      // before the collapse every balanced point sees the three edges at 120°: check one point
      const mid = r.branch.points[Math.floor(r.branch.points.length / 2)]!
      expect(mid.residualNorm).toBeLessThan(1e-9)
      // every accepted point, also the ones next to the collapse, meets the server's re-check bound
      // (F_u grows like 1/length there, so a small Newton update alone is no proof of convergence)
      expect(Math.max(...r.branch.points.map(p => p.residualNorm))).toBeLessThanOrEqual(1e-8)
    })
  }

  it('gives the Fermat length L² = (a² + b² + c²)/2 + 2√3·Area along the branch', () => {
    // classical formula for the minimal total length (Fermat–Torricelli, from memory)
    const r = runToEnd(fermatPair(0), { path: { kind: 'shear' }, to: 0.5 })
    let worst = 0
    for (const p of r.branch.points) {
      const a = p.lambda
      const sides = [1, Math.hypot(a, 1), Math.hypot(a - 1, 1)]
      const L2 = sides.reduce((s, x) => s + x * x, 0) / 2 + 2 * Math.sqrt(3) * 0.5
      worst = Math.max(worst, Math.abs(p.diagnostics!.totalLength! - Math.sqrt(L2)))
    }
    console.log(`fermat shear: total length vs closed form, max deviation ${worst.toExponential(2)} over ${r.branch.points.length} points`)
    expect(worst).toBeLessThan(1e-9)
  })
})

describe('twisted ring states in α1', () => {
  // Twisted state with winding: phase difference α1/n on every edge, Jacobian weights cos(α1/n),
  // singular at α1/n = π/2 (D. A. Wiley, S. H. Strogatz, M. Girvan, "The size of the sync basin",
  // Chaos 16, 015103, 2006): all n − 1 reduced eigenvalues cross zero together at α1 = nπ/2, the
  // whole reduced Jacobian vanishes. One name for every n, odd or even n − 1 alike.
  for (const n of [4, 5, 6, 7]) {
    it(`ring of ${n}: rigidity loss at α1 = ${n}π/2 with an inertia change of ${n - 1}`, () => {
      const exact = (n * Math.PI) / 2
      const r = runToEnd(ring(n), { path: { kind: 'alpha1' }, to: exact + 2, step: { max: 0.3 } })
      const kinds = r.branch.specialPoints.map(s => s.kind)
      expect(kinds).toEqual(['rigidity loss', 'bound'])
      const s = r.branch.specialPoints[0]!
      const dev = Math.abs(s.lambda - exact) / exact
      const before = r.branch.points[0]!.tests.negativeEigenvalues!, after = r.branch.points.at(-1)!.tests.negativeEigenvalues!
      console.log(`ring ${n}: rigidity loss at α1 = ${s.lambda}, ${n}π/2 = ${exact}, relative deviation ${dev.toExponential(2)}; inertia ${before} → ${after}`)
      expect(dev).toBeLessThan(1e-9)
      expect(Math.abs(before - after)).toBe(n - 1)
      expect(s.label).toContain(`kernel dimension ${n - 1}, negative eigenvalues ${before} → ${after}`)
      expect(s.located).toBe(true)
      expect(s.precision).toBeLessThanOrEqual(1e-9) // the default locate tolerance, reached
      // the state along the branch is the twisted state ψ_i = i·α1/n (ψ_0 pinned at 0)
      const mid = r.branch.points[Math.floor(r.branch.points.length / 2)]!
      mid.u.forEach((psi, i) => expect(psi).toBeCloseTo(((i + 1) * mid.lambda) / n, 9))
    })
  }
})

describe('plane bridge: wing rotation with a compensating wing set', () => {
  // Closed form (derived here): turning west-up and east-down by λ and west-down and east-up by μ,
  // balance at west reads u_span − e1 + R(λ)e2 − R(μ)e2 = 0 (east gives the same), so the drawing
  // stays put and μ = λ; the 2×2 Jacobian in (y_east, μ) is [[0, cos λ], [1/1.5, sin λ]],
  // singular at λ = π/2, where the turned wings become parallel to the span and the open wing
  // "west-out": an order flip.
  it('follows μ = λ with the drawing fixed and stops at the order flip at λ = π/2', () => {
    const r = runToEnd(planeBridge(), { path: { kind: 'wing-rotation', ...BRIDGE_WINGS }, to: 2.5 })
    let worst = 0
    for (const p of r.branch.points) worst = Math.max(worst, Math.abs(p.u[2]! - p.lambda), Math.abs(p.u[0]! - 1.5), Math.abs(p.u[1]!))
    console.log(`plane bridge: max |μ − λ|, position deviation ${worst.toExponential(2)} over ${r.branch.points.length} points`)
    expect(worst).toBeLessThan(1e-9)
    const s = r.branch.specialPoints.at(-1)!
    expect(s.kind).toBe('order flip')
    console.log(`plane bridge: order flip at λ = ${s.lambda}, π/2 deviation ${Math.abs(s.lambda - Math.PI / 2).toExponential(2)}`)
    expect(Math.abs(s.lambda - Math.PI / 2)).toBeLessThan(1e-8)
  })

  it('refuses wing sets whose directions do not sum to zero', () => {
    expect(() => new FamilyRunner(planeBridge(), { path: { kind: 'wing-rotation', rotate: ['west-up'], compensate: ['east-up', 'east-down'] }, to: 1 })).toThrow(/sum to zero/)
  })
})
