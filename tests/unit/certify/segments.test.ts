/**
 * Validated continuation between saved points (S. Day, J.-P. Lessard, K. Mischaikow, SIAM
 * J. Numer. Anal. 45, 2007): along a shear of the Fermat pair every segment certifies, and the
 * statement it proves is checked against the closed form — for λ across each segment the Fermat
 * point of the sheared triangle (X(13), C. Kimberling, Encyclopedia of Triangle Centers) lies within
 * the certified radius of the chord between the two saved points (the piece centres lie on it).
 * A segment with an uncertified end, or on the angle path (not affine in λ), is not certified.
 */
import { describe, expect, it } from 'vitest'
import { certifyFamilyPoints, certifyFamilySegments } from '../../../shared/certify/family'
import { latticePath } from '../../../shared/families/lattice-paths'
import { FamilyRunner } from '../../../shared/families/runner'
import { compilePattern } from '../../../shared/pattern/model'
import { parseFamilySettings, type FamilySettingsInput } from '../../../shared/types/family'
import { fermatPair } from '../families/fixtures'
import { isogonicCentre } from '../pattern/triangle-centres'

function family(settings: FamilySettingsInput) {
  const doc = fermatPair()
  const runner = new FamilyRunner(doc, settings)
  const points: { index: number, lambda: number, u: number[] }[] = []
  for (;;) {
    const b = runner.step({ points: 10, ms: 60_000 })
    points.push(...b.points.map(p => ({ index: p.index, lambda: p.lambda, u: Array.from(p.u) })))
    if (b.done) return { doc, points }
  }
}

/** Max-norm distance of x to the segment [a, b] (sampled finely; the distance is convex in t). */
function distanceToChord(x: [number, number], a: number[], b: number[]): number {
  let best = Infinity
  for (let k = 0; k <= 2000; k++) {
    const t = k / 2000
    best = Math.min(best, Math.max(Math.abs(a[0]! + t * (b[0]! - a[0]!) - x[0]), Math.abs(a[1]! + t * (b[1]! - a[1]!) - x[1])))
  }
  return best
}

describe('certified segments of a family', () => {
  it('shear of the Fermat pair: every segment certified, X(13) of each λ within the radius of the chord', () => {
    const settings = { path: { kind: 'shear' as const }, to: 0.6 }
    const { doc, points } = family(settings)
    const pc = certifyFamilyPoints(doc, settings, points)
    const segs = certifyFamilySegments(doc, settings, points, pc)
    expect(segs).toHaveLength(points.length - 1)
    const m = compilePattern(doc)
    const path = latticePath(parseFamilySettings(settings).path, m.lattice)
    const p0: [number, number] = [m.positions[0]!, m.positions[1]!]
    for (const [k, s] of segs.entries()) {
      expect(s.certificate.certified, `segment ${s.from}–${s.to}`).toBe(true)
      if (!s.certificate.certified) continue
      for (const t of [0, 0.25, 0.5, 0.75, 1]) {
        const lat = path.at(s.lambdaFrom + t * (s.lambdaTo - s.lambdaFrom)).lattice
        // the free vertex is joined to p0, p0 + ω1, p0 + ω2 (shifts 0, −e1, −e2; derived)
        const x13 = isogonicCentre(p0, [p0[0] + lat.w1[0], p0[1] + lat.w1[1]], [p0[0] + lat.w2[0], p0[1] + lat.w2[1]])
        expect(distanceToChord(x13, points[k]!.u, points[k + 1]!.u)).toBeLessThanOrEqual(s.certificate.rMin)
      }
    }
  })
  it('a segment with an uncertified end is not certified; the angle path is not covered', () => {
    const settings = { path: { kind: 'shear' as const }, to: 0.2 }
    const { doc, points } = family(settings)
    const pc = certifyFamilyPoints(doc, settings, points)
    pc[1] = { ...pc[1]!, certificate: { certified: false, size: 2, reason: 'enclosure-too-wide', detail: 'removed by the test' } }
    const segs = certifyFamilySegments(doc, settings, points, pc)
    expect(segs[0]!.certificate.certified).toBe(false)
    expect(segs[1]!.certificate.certified).toBe(false)
    const angle = { path: { kind: 'angle' as const }, to: 1.7 }
    const fam = family(angle)
    const segA = certifyFamilySegments(fam.doc, angle, fam.points, certifyFamilyPoints(fam.doc, angle, fam.points))
    expect(segA.length).toBeGreaterThan(0)
    for (const s of segA) {
      expect(s.certificate.certified).toBe(false)
      if (!s.certificate.certified) expect(s.certificate.reason).toBe('not-covered')
    }
  })
})
