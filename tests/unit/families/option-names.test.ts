/**
 * Every message names an option that exists, spelled as the user types it: the settings key
 * (checked against the settings schema) and the setup form's field.
 */
import { describe, expect, it, vi } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { FAMILY_OPTION_NAMES, FamilyRunner } from '../../../shared/families'
import { analyzePattern } from '../../../shared/pattern/analyze'
import { FamilySettingsSchema, parseFamilySettings, type FamilySettingsInput } from '../../../shared/types/family'
import { ALLOW_SINGULAR_LABEL, defaultSetupForm, formToSettings, startRefusal } from '../../../app/utils/family/setup'
import { fermatPair } from './fixtures'

vi.mock('#shared/types/family', () => import('../../../shared/types/family'))

/** True when the dotted key is a field of the family settings schema. */
function isSettingsKey(key: string): boolean {
  let shape: Record<string, unknown> = FamilySettingsSchema.shape
  for (const part of key.split('.')) {
    let f = shape[part] as { unwrap?: () => unknown, shape?: Record<string, unknown>, def?: { innerType?: unknown } } | undefined
    if (!f) return false
    while (f && !f.shape && f.def?.innerType) f = f.def.innerType as typeof f // .default() / .optional()
    shape = f?.shape ?? {}
  }
  return true
}

const weave = findPatternExample('three-line-weave')!.document // not rigid (the lines slide), see tests/unit/pattern

function runToEnd(doc: Parameters<typeof analyzePattern>[0], settings: FamilySettingsInput) {
  const r = new FamilyRunner(doc, settings)
  while (!r.done) r.step({ points: 1000, ms: 60_000 })
  return r.result()
}

describe('messages name options that exist', () => {
  it('every option a family message names is a settings key', () => {
    for (const name of Object.values(FAMILY_OPTION_NAMES)) expect(isSettingsKey(name.split(' ')[0]!), name).toBe(true)
    expect(isSettingsKey('notAKey')).toBe(false)
  })

  it('a refused start says how to start anyway, and that setting is accepted and works', () => {
    const refused = runToEnd(weave, { path: { kind: 'shear' }, to: 0.2 })
    expect(refused.status).toBe('refused')
    expect(refused.branch.finishReason).toContain('set allowSingularStart (form: “start even if the start is not rigid”')
    expect(() => parseFamilySettings({ path: { kind: 'shear' }, to: 0.2, allowSingularStart: true })).not.toThrow()
    const started = runToEnd(weave, { path: { kind: 'shear' }, to: 0.2, allowSingularStart: true, stop: { maxPoints: 5 } })
    expect(started.status).not.toBe('refused')
    expect(started.branch.points.length).toBeGreaterThan(1)
  })

  it('the setup form refuses a non-rigid start naming its checkbox, and the checkbox lifts the refusal', () => {
    const summary = analyzePattern(weave).summary as unknown as Record<string, unknown>
    expect(startRefusal(summary, 'shear', true)?.reason).toContain(`tick “${ALLOW_SINGULAR_LABEL}” under Advanced`)
    expect(startRefusal(summary, 'shear', true, true)).toBeNull()
    expect(formToSettings({ ...defaultSetupForm('shear'), allowSingularStart: true }).settings?.allowSingularStart).toBe(true)
  })

  it('a run that gives up names the step setting a user can change', () => {
    const r = runToEnd(fermatPair(0), { path: { kind: 'shear' }, to: -2, stop: { collapseTolerance: 1e-10 } })
    expect(r.branch.finishReason).toContain('step.min (form: “Smallest step”) = 1e-8')
  })
})
