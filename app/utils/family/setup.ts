/**
 * The run setup form's model: which path kinds fit a pattern, the form state ↔ settings, and
 * the start check (a run refuses to start on a non-rigid pattern, or on an unbalanced one unless
 * it is balanced first). Pure.
 */
import { FamilySettingsSchema, LATTICE_PATH_KINDS, PHASE_PATH_KINDS, PLANE_PATH_KINDS, type FamilySettings } from '#shared/types/family'
import type { PatternDocument } from '#shared/types/pattern'

/** Path kinds that apply to a pattern in this space. */
export function pathKindsFor(space: 'torus' | 'plane'): string[] {
  return space === 'torus' ? [...LATTICE_PATH_KINDS, ...PHASE_PATH_KINDS] : [...PLANE_PATH_KINDS, 'weight-scale']
}

/** Flat form state (text fields for lists and vectors). */
export interface SetupForm {
  name: string
  kind: string
  to: number
  direction: '' | 'increase' | 'decrease'
  /** interpolate: "w1x, w1y, w2x, w2y"; tau-polyline: "x, y; x, y"; alpha-line: "dx, dy"; ids for the rest. */
  pathArg: string
  pathArg2: string
  balanceFirst: boolean
  /** Settings key allowSingularStart (checkbox “start even if the start is not rigid”). */
  allowSingularStart: boolean
  step: { initial?: number, min?: number, max?: number, maxNewtonIterations?: number, chord?: boolean }
  stop: { maxPoints: number, collapseTolerance: number, orderFlip: boolean, stopAtEvents: boolean, stopAtSpecialPoint: boolean, locateTolerance: number }
}

/** Defaults of the form (step options empty: the engine's defaults apply). */
export function defaultSetupForm(kind = 'shear'): SetupForm {
  return { name: '', kind, to: 1, direction: '', pathArg: '', pathArg2: '', balanceFirst: true, allowSingularStart: false, step: {}, stop: { maxPoints: 500, collapseTolerance: 1e-3, orderFlip: true, stopAtEvents: true, stopAtSpecialPoint: false, locateTolerance: 1e-9 } }
}

const nums = (s: string) => s.split(/[,;\s]+/).filter(Boolean).map(Number)
const ids = (s: string) => s.split(/[,\s]+/).filter(Boolean)

/** Toggles `id` in a comma-separated list (the pickers edit the form's text fields). */
export function toggleId(list: string, id: string): string {
  const have = ids(list)
  return (have.includes(id) ? have.filter(x => x !== id) : [...have, id]).join(', ')
}

/** The ids of a comma-separated list as a set (for the pickers' checked state). */
export const idSet = (list: string): Set<string> => new Set(ids(list))

/** The path object for the form's kind and arguments (unvalidated). */
function pathOf(f: SetupForm): Record<string, unknown> {
  switch (f.kind) {
    case 'interpolate': { const [a, b, c, d] = nums(f.pathArg); return { kind: f.kind, target: { w1: [a, b], w2: [c, d] } } }
    case 'tau-polyline': return { kind: f.kind, points: f.pathArg.split(';').filter(s => s.trim()).map(nums) }
    case 'alpha-line': return { kind: f.kind, direction: nums(f.pathArg).slice(0, 2) }
    case 'weight-scale': return { kind: f.kind, edges: ids(f.pathArg) }
    case 'wing-rotation': return { kind: f.kind, rotate: ids(f.pathArg), compensate: ids(f.pathArg2) }
    default: return { kind: f.kind }
  }
}

const clean = <T extends object>(o: T) => Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined && v !== null && v !== '' && !Number.isNaN(v))) as Partial<T>

/**
 * What each field's message says when the schema refuses it: a sentence about the field, never
 * the schema's own wording. Keys are field paths of the settings.
 */
export const FIELD_MESSAGES: Record<string, string> = {
  'to': 'Enter the target λ as a number.',
  'direction': 'Choose a direction.',
  'path.target': 'Enter the target lattice as four numbers: ω1x, ω1y, ω2x, ω2y.',
  'path.points': 'Enter at least one corner of the τ polyline as two numbers x, y (separate corners with ;).',
  'path.direction': 'Enter the direction in the (α1, α2) plane as two numbers.',
  'path.edges': 'Choose at least one edge whose weights scale.',
  'path.rotate': 'Choose at least one wing that turns by λ.',
  'path.compensate': 'Choose at least one compensating wing.',
  'step.initial': 'The first step must be a positive number.',
  'step.min': 'The smallest step must be a positive number.',
  'step.max': 'The largest step must be a positive number.',
  'step.maxNewtonIterations': 'The Newton iterations per step must be a whole number, at least 1.',
  'stop.maxPoints': 'Most points must be a whole number, at least 1.',
  'stop.collapseTolerance': 'The collapse fraction must be a number between 0 and 1.',
  'stop.locateTolerance': 'The locate tolerance must be a positive number.',
}

/** The message for a refused field path (the first two parts name the field: path.points.0.1 → path.points). */
function fieldMessage(path: (string | number | symbol)[]): string {
  const key = path.slice(0, 2).map(String).join('.')
  return FIELD_MESSAGES[key] ?? FIELD_MESSAGES[String(path[0])] ?? 'Check this field: its value is not accepted.'
}

/** The form's key for an issue path (the field it belongs to). */
const fieldKey = (path: (string | number | symbol)[]) => path.slice(0, 2).map(String).join('.') || 'form'

/** Unit direction sum of the listed wings of a plane document; unknown ids are returned apart. */
function wingSum(doc: PatternDocument, ids: string[]): { sum: [number, number], unknown: string[] } {
  let x = 0, y = 0
  const unknown: string[] = []
  for (const id of ids) {
    const w = doc.wings?.find(v => v.id === id)
    if (!w) { unknown.push(id); continue }
    const n = Math.hypot(w.direction[0], w.direction[1]) || 1
    x += w.direction[0] / n; y += w.direction[1] / n
  }
  return { sum: [x, y], unknown }
}

/**
 * Choices the pattern itself refuses, checked before a run is created (the core would refuse
 * them at the start): unknown ids, wing sets whose directions do not sum to zero (Σ_open u_h must
 * stay 0, see shared/families/plane.ts), a wing in both sets.
 */
export function choiceErrors(f: SetupForm, doc: PatternDocument): Record<string, string> {
  const errors: Record<string, string> = {}
  if (f.kind === 'weight-scale') {
    const bad = ids(f.pathArg).filter(id => !doc.edges.some(e => e.id === id))
    if (bad.length) errors['path.edges'] = `The pattern has no edge ${bad.join(', ')}; choose edges of the pattern.`
  }
  if (f.kind === 'wing-rotation') {
    const sets = [['path.rotate', ids(f.pathArg), 'turning'], ['path.compensate', ids(f.pathArg2), 'compensating']] as const
    for (const [key, list, name] of sets) {
      if (!list.length) continue
      const { sum, unknown } = wingSum(doc, [...list])
      if (unknown.length) errors[key] = `The pattern has no wing ${unknown.join(', ')}; choose wings of the pattern.`
      else if (Math.hypot(sum[0], sum[1]) > 1e-9) errors[key] = `The directions of the ${name} wings must sum to zero (now (${sum.map(v => Number(v.toFixed(3))).join(', ')})): choose them in balancing groups, e.g. opposite pairs.`
    }
    const both = ids(f.pathArg).filter(id => ids(f.pathArg2).includes(id))
    if (both.length && !errors['path.compensate']) errors['path.compensate'] = `A wing cannot both turn and compensate: ${both.join(', ')}.`
  }
  return errors
}

/** Validates the form with the shared schema (and, given the pattern, its choices): settings, or a sentence per field. */
export function formToSettings(f: SetupForm, doc?: PatternDocument): { settings?: FamilySettings, errors: Record<string, string> } {
  const input = { path: pathOf(f), to: f.to, ...(f.direction ? { direction: f.direction } : {}), balanceFirst: f.balanceFirst, ...(f.allowSingularStart ? { allowSingularStart: true } : {}), step: clean(f.step), stop: f.stop }
  const r = FamilySettingsSchema.safeParse(input)
  const errors: Record<string, string> = doc ? choiceErrors(f, doc) : {}
  if (r.success && !Object.keys(errors).length) return { settings: r.data, errors: {} }
  if (!r.success) for (const i of r.error.issues) errors[fieldKey(i.path)] ??= fieldMessage(i.path)
  return { errors }
}

/** Form state from stored settings ("duplicate settings into a new run", restarts). */
export function settingsToForm(s: FamilySettings, name = ''): SetupForm {
  const p = s.path as Record<string, unknown> & { kind: string }
  let pathArg = '', pathArg2 = ''
  if (p.kind === 'interpolate') { const t = p.target as { w1: number[], w2: number[] }; pathArg = [...t.w1, ...t.w2].join(', ') }
  if (p.kind === 'tau-polyline') pathArg = (p.points as number[][]).map(q => q.join(', ')).join('; ')
  if (p.kind === 'alpha-line') pathArg = (p.direction as number[]).join(', ')
  if (p.kind === 'weight-scale') pathArg = (p.edges as string[]).join(', ')
  if (p.kind === 'wing-rotation') { pathArg = (p.rotate as string[]).join(', '); pathArg2 = (p.compensate as string[]).join(', ') }
  return { name, kind: p.kind, to: s.to, direction: s.direction ?? '', pathArg, pathArg2, balanceFirst: s.balanceFirst, allowSingularStart: s.allowSingularStart === true, step: { ...s.step }, stop: { ...s.stop } }
}

/** The setup form's label of the allowSingularStart checkbox (messages name it). */
export const ALLOW_SINGULAR_LABEL = 'start even if the start is not rigid'

/**
 * Why a run may not start from this pattern (null: it may); `balanceFixes` when balancing first
 * would fix it. A start that is not rigid may start when `allowSingular` (allowSingularStart) is set.
 */
export function startRefusal(summary: Record<string, unknown> | null, kind: string, balanceFirst: boolean, allowSingular = false): { reason: string, balanceFixes: boolean } | null {
  if (!summary) return null
  const phase = (PHASE_PATH_KINDS as readonly string[]).includes(kind)
  const anyway = `To start anyway, tick “${ALLOW_SINGULAR_LABEL}” under Advanced.`
  if (!allowSingular && phase && summary.phaseRigid === false) return { reason: `The phases are not rigid (the phase-rigidity verdict failed): the family is not locally unique there. ${anyway}`, balanceFixes: false }
  if (!allowSingular && !phase && summary.rigid === false) return { reason: `The start is not rigid (the rigidity verdict failed): the family is not locally unique there. ${anyway}`, balanceFixes: false }
  if (summary.balanced === false && !balanceFirst) return { reason: 'The start is not balanced (the balance verdict failed).', balanceFixes: true }
  return null
}
