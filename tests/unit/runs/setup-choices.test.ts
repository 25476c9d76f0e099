/**
 * The setup form: messages are sentences about the field (never the schema's wording), wing
 * choices the pattern refuses are refused before a run is created, and the plane offers exactly
 * the paths the core can run there.
 */
import { describe, expect, it, vi } from 'vitest'
import { findPatternExample } from '../../../shared/examples'
import { familyProblem } from '../../../shared/families/build'
import { FAMILY_PATH_KINDS, parseFamilySettings } from '../../../shared/types/family'

vi.mock('#shared/types/family', () => import('../../../shared/types/family'))
const { defaultSetupForm, formToSettings, pathKindsFor, toggleId, FIELD_MESSAGES } = await import('../../../app/utils/family/setup')

const bridge = findPatternExample('plane-bridge')!.document
const form = (kind: string, pathArg = '', pathArg2 = '') => ({ ...defaultSetupForm(kind), name: 'r', pathArg, pathArg2 })

describe('setup form messages', () => {
  it('an empty wing choice says "choose at least one wing", not the schema message', () => {
    const r = formToSettings(form('wing-rotation'), bridge)
    expect(r.errors['path.rotate']).toBe('Choose at least one wing that turns by λ.')
    expect(r.errors['path.compensate']).toBe('Choose at least one compensating wing.')
    for (const m of Object.values(r.errors)) expect(m).not.toMatch(/expected|Too small|>=|Invalid/)
  })

  it('every refused field of a badly filled form gets a sentence', () => {
    const f = { ...form('tau-polyline', 'x'), to: Number.NaN, step: { initial: -1 }, stop: { ...defaultSetupForm().stop, maxPoints: 0, collapseTolerance: 2 } }
    const r = formToSettings(f)
    expect(r.errors).toEqual({
      'to': FIELD_MESSAGES.to, 'path.points': FIELD_MESSAGES['path.points'], 'step.initial': FIELD_MESSAGES['step.initial'],
      'stop.maxPoints': FIELD_MESSAGES['stop.maxPoints'], 'stop.collapseTolerance': FIELD_MESSAGES['stop.collapseTolerance'],
    })
    for (const m of Object.values(r.errors)) expect(m).toMatch(/^[A-Z].*\.$/)
  })
})

describe('wing choices checked against the pattern', () => {
  // plane-bridge: the rotate set west-up + east-down and the compensate set west-down + east-up each
  // sum to zero (see tests/unit/families/references.test.ts); west-up alone does not
  it('refuses a turning set whose directions do not sum to zero, as the core would', () => {
    const r = formToSettings(form('wing-rotation', 'west-up', 'west-down, east-up'), bridge)
    expect(r.settings).toBeUndefined()
    expect(r.errors['path.rotate']).toMatch(/^The directions of the turning wings must sum to zero \(now \(/)
    const settings = parseFamilySettings({ path: { kind: 'wing-rotation', rotate: ['west-up'], compensate: ['west-down', 'east-up'] }, to: 1 })
    expect(() => familyProblem(bridge, settings)).toThrow(/sum to zero/)
  })

  it('accepts balanced sets and refuses a wing in both, or one the pattern lacks', () => {
    expect(formToSettings(form('wing-rotation', 'west-up, east-down', 'west-down, east-up'), bridge).settings).toBeDefined()
    expect(formToSettings(form('wing-rotation', 'west-up, east-down', 'west-up, east-down'), bridge).errors['path.compensate']).toMatch(/cannot both turn and compensate/)
    expect(formToSettings(form('wing-rotation', 'west-up, nowhere', 'west-down, east-up'), bridge).errors['path.rotate']).toBe('The pattern has no wing nowhere; choose wings of the pattern.')
    expect(formToSettings(form('weight-scale', 'span, ghost'), bridge).errors['path.edges']).toBe('The pattern has no edge ghost; choose edges of the pattern.')
  })

  it('the pickers toggle ids in the form field', () => {
    expect(toggleId('', 'a')).toBe('a')
    expect(toggleId('a, b', 'a')).toBe('b')
    expect(toggleId('b', 'a')).toBe('b, a')
  })
})

describe('paths offered in the plane', () => {
  it('are exactly the kinds the core can build on a plane pattern', () => {
    const args: Record<string, object> = {
      'interpolate': { target: { w1: [1, 0], w2: [0, 1] } }, 'tau-polyline': { points: [[0, 1]] }, 'alpha-line': { direction: [1, 0] },
      'weight-scale': { edges: [bridge.edges[0]!.id] }, 'wing-rotation': { rotate: ['west-up', 'east-down'], compensate: ['west-down', 'east-up'] },
    }
    const meaningful = FAMILY_PATH_KINDS.filter((kind) => {
      try { familyProblem(bridge, parseFamilySettings({ path: { kind, ...args[kind] }, to: 1 })); return true } catch { return false }
    })
    expect([...pathKindsFor('plane')].sort()).toEqual([...meaningful].sort())
  })
})
