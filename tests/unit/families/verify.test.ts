/** verifyFamilyPoints: untampered points of a run pass, tampered points are rejected by index. */
import { describe, expect, it } from 'vitest'
import { FamilyRunner, verifyFamilyPoints } from '../../../shared/families'
import type { FamilySettingsInput } from '../../../shared/types/family'
import type { PatternDocument } from '../../../shared/types/pattern'
import { BRIDGE_WINGS, fermatPair, planeBridge, ring } from './fixtures'

function run(doc: PatternDocument, settings: FamilySettingsInput) {
  const r = new FamilyRunner(doc, settings)
  while (!r.done) r.step({ points: 1000, ms: 60_000 })
  return r.result()
}

describe('verifyFamilyPoints', () => {
  const cases: [string, () => PatternDocument, FamilySettingsInput][] = [
    ['lattice shear', () => fermatPair(), { path: { kind: 'shear' }, to: 0.5 }],
    ['phase α1', () => ring(5), { path: { kind: 'alpha1' }, to: 3 }],
    ['wing rotation', planeBridge, { path: { kind: 'wing-rotation', ...BRIDGE_WINGS }, to: 1 }],
  ]
  for (const [name, doc, settings] of cases) {
    it(`${name}: passes the run's own points and names a tampered one`, () => {
      const res = run(doc(), settings)
      const pts = res.branch.points
      expect(pts.length).toBeGreaterThan(3)
      const ok = verifyFamilyPoints(doc(), res.settings, pts)
      expect(ok.verified).toBe(true)
      expect(ok.checked).toBe(pts.length)
      expect(ok.maxResidual).toBeLessThan(1e-9)
      // move one unknown of point 2 by 1e-4 (a small but real change), and λ of point 3
      const tampered = pts.map(p => ({ index: p.index, lambda: p.lambda, u: [...p.u] }))
      tampered[2]!.u[0]! += 1e-4
      tampered[3]!.lambda += 1e-3
      const bad = verifyFamilyPoints(doc(), res.settings, tampered)
      expect(bad.verified).toBe(false)
      expect(bad.offending.map(o => o.index)).toEqual([2, 3])
    })
  }

  it('rejects malformed points with a reason', () => {
    const v = verifyFamilyPoints(fermatPair(), { path: { kind: 'shear' }, to: 1 }, [{ lambda: 0, u: [1] }, { lambda: Number.NaN, u: [0.5, 0.3] }])
    expect(v.offending.map(o => o.reason)).toEqual([expect.stringMatching(/length 1, expected 2/), 'non-finite value'])
  })
})
