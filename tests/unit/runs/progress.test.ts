/** Progress of a live run is measured towards the target λ, not against the point limit. */
import { describe, expect, it } from 'vitest'
import { runProgress } from '../../../app/utils/family/progress'

const settings = { to: 3, stop: { maxPoints: 500 } } as Parameters<typeof runProgress>[2]

describe('runProgress', () => {
  it('λ = 2.66 on a 1 → 3 path is 83 % of the way (whatever the point count)', () => {
    // (2.66 − 1) / (3 − 1) = 0.83 (derived)
    const p = runProgress(2.66, 1, settings, 370)
    expect(p.fraction).toBeCloseTo(0.83, 12)
    expect(p.label).toContain('83 %')
    expect(p.label).toContain('from 1 to 3')
  })
  it('counts towards a target below the start, and goes back when λ turns back', () => {
    expect(runProgress(-0.5, 0, { ...settings, to: -2 }, 10).fraction).toBeCloseTo(0.25, 12)
    expect(runProgress(0.5, 0, { ...settings, to: -2 }, 10).fraction).toBe(0)
  })
  it('with the target at the start, says it counts points against the limit', () => {
    const p = runProgress(1, 1, { ...settings, to: 1 }, 50)
    expect(p.fraction).toBeCloseTo(0.1, 12)
    expect(p.label).toBe('50 of at most 500 points (10 %)')
  })
})
