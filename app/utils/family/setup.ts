/**
 * The run setup form's model: which path kinds fit a pattern, the form state ↔ settings, and
 * the start check (a run refuses to start on a non-rigid pattern, or on an unbalanced one unless
 * it is balanced first). Pure.
 */
import { FamilySettingsSchema, LATTICE_PATH_KINDS, PHASE_PATH_KINDS, PLANE_PATH_KINDS, type FamilySettings } from '#shared/types/family'

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

/** Validates the form with the shared schema: settings, or messages by field path. */
export function formToSettings(f: SetupForm): { settings?: FamilySettings, errors: Record<string, string> } {
  const input = { path: pathOf(f), to: f.to, ...(f.direction ? { direction: f.direction } : {}), balanceFirst: f.balanceFirst, ...(f.allowSingularStart ? { allowSingularStart: true } : {}), step: clean(f.step), stop: f.stop }
  const r = FamilySettingsSchema.safeParse(input)
  if (r.success) return { settings: r.data, errors: {} }
  const errors: Record<string, string> = {}
  for (const i of r.error.issues) errors[i.path.join('.') || 'form'] ??= i.message
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
