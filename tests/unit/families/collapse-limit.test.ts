/**
 * A collapse is reported where the edge reaches length 0, not where it passes the stop tolerance:
 * the Fermat pair under shear with default settings against the Fermat–Torricelli closed form.
 */
import { describe, expect, it } from 'vitest'
import { FamilyRunner, verifyFamilyPoints } from '../../../shared/families'
import type { FamilySettingsInput } from '../../../shared/types/family'
import { fermatPair } from './fixtures'

function runToEnd(settings: FamilySettingsInput) {
  const r = new FamilyRunner(fermatPair(0), settings)
  while (!r.done) r.step({ points: 1000, ms: 60_000 })
  return r.result()
}

describe('collapse located at length 0 (Fermat pair, ω1 = (1, 0), ω2 = (a, 1), shear a)', () => {
  // Fermat–Torricelli (first isogonic centre X(13), C. Kimberling, Encyclopedia of Triangle
  // Centers): the balanced vertex sits at a corner of the triangle (0, ω1, ω2) once that corner's
  // angle reaches 120°. At 0: cos = a/√(1 + a²) = −1/2 ⇔ a = −1/√3; at ω1 by the reflection
  // x ↦ 1 − x: a = 1 + 1/√3 (derived; see references.test.ts).
  const cases = [
    { to: -2, exact: -1 / Math.sqrt(3), edge: 'to-origin' },
    { to: 3, exact: 1 + 1 / Math.sqrt(3), edge: 'to-w1' },
  ]
  for (const c of cases) {
    it(`default settings: edge ${c.edge} collapses at a = ${c.exact.toFixed(9)} to 1e-8 relative`, () => {
      const r = runToEnd({ path: { kind: 'shear' }, to: c.to })
      const s = r.branch.specialPoints.at(-1)!
      expect(s.kind).toBe('collapse')
      const rel = Math.abs(s.lambda - c.exact) / Math.abs(c.exact)
      console.log(`collapse limit: a = ${s.lambda}, exact ${c.exact}, relative ${rel.toExponential(2)}, precision ${s.precision.toExponential(2)}, stopped at ${s.stoppedAt?.lambda}`)
      expect(rel).toBeLessThan(1e-8)
      expect(s.located).toBe(true)
      expect(s.precision).toBeLessThanOrEqual(1e-9)
      expect(s.label).toContain(`edge ${c.edge} reaches length 0`)
      // the tolerance (1e-3 of the mean length, default) only says where the run stopped: before the limit
      expect(Math.abs(s.stoppedAt!.lambda - c.exact)).toBeGreaterThan(1e-5)
      expect(Math.sign(c.exact - s.stoppedAt!.lambda)).toBe(Math.sign(c.to))
      expect(r.branch.points.at(-1)!.lambda).toBeCloseTo(s.stoppedAt!.lambda, 12)
      // the stored limit passes the server's re-check (contracted drawing balanced, edge length 0)
      const v = verifyFamilyPoints(fermatPair(0), r.settings, [{ index: 0, lambda: s.lambda, u: s.u, kind: s.kind }], 1e-8)
      expect(v.verified).toBe(true)
      // …and a limit moved off the collapse does not
      const off = verifyFamilyPoints(fermatPair(0), r.settings, [{ index: 0, lambda: s.lambda + 1e-4, u: s.u, kind: s.kind }], 1e-8)
      expect(off.verified).toBe(false)
    })
  }
})
