/**
 * Where a collapsed run stopped, beside where the collapse is: the Fermat pair sheared towards
 * a = −1/√3, where the corner angle at 0 reaches 120° (Fermat–Torricelli; first isogonic centre
 * X(13), C. Kimberling, Encyclopedia of Triangle Centers; derived in references.test.ts). The run
 * stops at the collapse tolerance before it; the special-point rows carry both, live and stored.
 */
import { describe, expect, it, vi } from 'vitest'
import { RunSpecialPointSchema, type StoredRunPoint } from '../../../shared/types/runs'
import { FamilyRunner } from '../../../shared/families/runner'
import { fermatPair } from '../families/fixtures'

vi.mock('#shared/types/family', () => import('../../../shared/types/family'))
const { liveSpecialToView, storedSpecialToView, specialRows } = await import('../../../app/utils/family/points')

describe('special-point rows: run stopped at', () => {
  const r = new FamilyRunner(fermatPair(0), { path: { kind: 'shear' }, to: -2 })
  while (!r.done) r.step({ points: 1000, ms: 60_000 })
  const s = r.result().branch.specialPoints.at(-1)!

  it('live: the collapse λ = −1/√3 and the stop λ before it (on the start side)', () => {
    expect(s.kind).toBe('collapse')
    const [row] = specialRows(0, [liveSpecialToView(s)], [])
    expect(Math.abs(row!.lambda + 1 / Math.sqrt(3))).toBeLessThan(1e-8)
    expect(row!.stoppedAt).toBe(s.stoppedAt!.lambda)
    expect(row!.stoppedAt!).toBeGreaterThan(row!.lambda + 1e-5)
  })

  it('stored as the server keeps it (payload without index, λ and kind as state): the same stop', () => {
    const { index, lambda, kind, ...rest } = RunSpecialPointSchema.parse(s)
    const stored: StoredRunPoint = { index: -1 - index, lambda, residual: 0, specialKind: kind, state: JSON.parse(JSON.stringify(rest)), diagnostics: {} }
    const [row] = specialRows(0, [storedSpecialToView(stored)], [])
    expect(row!.stoppedAt).toBe(s.stoppedAt!.lambda)
  })

  it('a point without a stop (a fold or a wall) has none', () => {
    const [row] = specialRows(0, [liveSpecialToView({ ...s, stoppedAt: undefined })], [])
    expect(row!.stoppedAt).toBeNull()
  })
})
