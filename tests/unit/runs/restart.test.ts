/** A restart from a stored point through the runner's `from` continues the same branch. */
import { describe, expect, it } from 'vitest'
import { FamilyRunner } from '../../../shared/families/runner'
import { restartFrom } from '../../../shared/continuation/engine'
import { verifyFamilyPoints } from '../../../shared/families/verify'
import { findPatternExample } from '../../../shared/examples'

const doc = findPatternExample('fermat-pair')!.document
const settings = { path: { kind: 'shear' as const }, to: -2, stop: { collapseTolerance: 1e-6 } }
const toEnd = (r: FamilyRunner) => { while (!r.done) r.step({ points: 50, ms: 60_000 }); return r.result() }

describe('restart through FamilyRunner(doc, settings, from)', () => {
  const whole = toEnd(new FamilyRunner(doc, settings))
  const k = Math.floor(whole.branch.points.length / 2)
  // JSON round trip: the start comes from the server as stored JSON
  const stored = JSON.parse(JSON.stringify(whole.branch.points[k]))
  const again = toEnd(new FamilyRunner(doc, settings, restartFrom(stored)))

  it('begins exactly at the stored point and takes the same next step', () => {
    expect(again.branch.points[0]!.lambda).toBe(stored.lambda)
    expect(again.branch.points[0]!.u).toEqual(stored.u)
    const next = again.branch.points[1]!, orig = whole.branch.points[k + 1]!
    expect(Math.abs(next.lambda - orig.lambda)).toBeLessThan(1e-12)
  })

  it('reaches the same collapse, and every point passes the server check (max|F| ≤ 1e-8)', () => {
    expect(again.branch.specialPoints.map(s => s.kind)).toEqual(['collapse'])
    expect(Math.abs(again.branch.specialPoints[0]!.lambda - whole.branch.specialPoints[0]!.lambda)).toBeLessThan(1e-9)
    expect(verifyFamilyPoints(doc, settings, again.branch.points, 1e-8).verified).toBe(true)
  })
})
