/** Run setup form model, start refusals, restart starts and kernel arrows. */
import { describe, expect, it, vi } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { FamilyRunner } from '../../../shared/families/runner'
import { restartFrom } from '../../../shared/continuation/engine'

vi.mock('#shared/types/family', () => import('../../../shared/types/family'))

const { defaultSetupForm, formToSettings, settingsToForm, startRefusal, pathKindsFor } = await import('../../../app/utils/family/setup')
const { restartStart, liveToView, liveSpecialToView } = await import('../../../app/utils/family/points')
const { kernelArrows } = await import('../../../app/utils/family/kernel')

describe('setup form', () => {
  it('turns the form into validated settings and back', () => {
    const f = { ...defaultSetupForm('weight-scale'), name: 'w', to: 2, pathArg: 'a, b' }
    const r = formToSettings(f)
    expect(r.errors).toEqual({})
    expect(r.settings!.path).toEqual({ kind: 'weight-scale', edges: ['a', 'b'] })
    expect(settingsToForm(r.settings!, 'w')).toMatchObject({ kind: 'weight-scale', pathArg: 'a, b', to: 2 })
  })

  it('names the failing field', () => {
    const r = formToSettings({ ...defaultSetupForm('shear'), to: Number.NaN, stop: { ...defaultSetupForm().stop, maxPoints: 0 } })
    expect(Object.keys(r.errors).sort()).toEqual(['stop.maxPoints', 'to'])
  })

  it('offers torus paths for torus patterns and wing/weight paths in the plane', () => {
    expect(pathKindsFor('torus')).toContain('shear')
    expect(pathKindsFor('plane')).toEqual(['wing-rotation', 'weight-scale'])
  })

  it('refuses a non-rigid start and an unbalanced one unless it is balanced first (verdicts of the core)', () => {
    const weave = analyzePattern(findPatternExample('three-line-weave')!.document).summary as unknown as Record<string, unknown>
    expect(startRefusal(weave, 'shear', true)?.reason).toMatch(/rigidity verdict/)
    const fermat = analyzePattern(findPatternExample('fermat-pair')!.document).summary as unknown as Record<string, unknown>
    expect(startRefusal(fermat, 'shear', false)).toMatchObject({ balanceFixes: true })
    expect(startRefusal(fermat, 'shear', true)).toBeNull()
  })
})

describe('restarts', () => {
  const runner = new FamilyRunner(findPatternExample('fermat-pair')!.document, { path: { kind: 'shear' }, to: -2 })
  while (!runner.done) runner.step({ points: 50, ms: 60_000 })
  const r = runner.result()

  it('continue from a stored point exactly as the engine restarts it', () => {
    const p = r.branch.points[3]!
    expect(restartStart(liveToView(p))).toEqual({ ...restartFrom(p), u: [...p.u] })
  })

  it('switch along a unit kernel direction and refuse points without a kernel', () => {
    const s = { ...liveSpecialToView(r.branch.specialPoints[0]!), kernel: [3, 4, 0] }
    const t = restartStart(s, 'switch').tangent!
    expect(Math.hypot(...t)).toBeCloseTo(1, 14)
    expect(t).toEqual([0.6, 0.8, 0])
    expect(() => restartStart({ ...s, kernel: undefined }, 'switch')).toThrow(/kernel/)
  })

  it('draws a kernel as one arrow per free vertex', () => {
    const a = kernelArrows(findPatternExample('fermat-pair')!.document, 'shear', [0, -2, 1])
    expect(a).toEqual([{ label: 'free', angleDeg: -90, relative: 1 }])
  })
})
