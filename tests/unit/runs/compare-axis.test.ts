/** The comparison's default x axis is a quantity all compared runs share, and it says when there is none. */
import { describe, expect, it, vi } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { FamilyRunner } from '../../../shared/families/runner'
import type { FamilySettingsInput } from '../../../shared/types/family'

vi.mock('#shared/types/family', () => import('../../../shared/types/family'))
vi.mock('#shared/runs/units', () => import('../../../shared/runs/units'))
const { availableAxes, axisValue } = await import('../../../app/utils/family/axes')
const { defaultCompareAxis } = await import('../../../app/utils/family/compare-axis')

function run(slug: string, settings: FamilySettingsInput) {
  const r = new FamilyRunner(findPatternExample(slug)!.document, settings)
  while (!r.done) r.step({ points: 1000, ms: 60_000 })
  const points = r.result().branch.points.map(p => ({ index: p.index, lambda: p.lambda, u: p.u, arclength: p.arclength, sigmaMin: p.sigmaMin, diagnostics: p.diagnostics ?? {} }))
  return { kind: settings.path.kind, points }
}
const common = (runs: ReturnType<typeof run>[]) => {
  const lists = runs.map(r => availableAxes(r.kind, [], Object.keys(r.points[0]!.diagnostics)).map(a => a.key))
  return lists[0]!.filter(k => lists.every(l => l.includes(k)))
}

describe('default x axis of a comparison', () => {
  const shear = run('fermat-pair', { path: { kind: 'shear' }, to: 0.3 })
  const stretch = run('fermat-pair', { path: { kind: 'stretch' }, to: 1.6 })

  it('a shear and a stretch share the lattice angle arg τ (not λ: s of one, Im τ of the other)', () => {
    const d = defaultCompareAxis([shear, stretch], common([shear, stretch]))
    expect(d).toEqual({ key: 'latticeAngle', shared: true })
    // fermat-pair: ω1 = (2, 0), ω2 = (1, 2) + s·ω1 → τ = (1 + 2s)/2 + i (derived), arg τ = atan2(1, 1/2 + s)
    for (const p of shear.points) expect(axisValue(p, 'latticeAngle')).toBeCloseTo(Math.atan2(1, 0.5 + p.lambda), 10)
  })

  it('runs of one kind keep λ', () => {
    expect(defaultCompareAxis([shear, shear], common([shear, shear]))).toEqual({ key: 'lambda', shared: true })
  })

  it('a lattice path and a phase path share nothing: says so', () => {
    const phase = run('square-pair', { path: { kind: 'alpha1' }, to: 1.5 })
    expect(defaultCompareAxis([shear, phase], common([shear, phase]))).toEqual({ key: 'lambda', shared: false })
  })
})
