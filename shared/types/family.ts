/**
 * Family settings: everything needed to reproduce one continuation run of a pattern (the path,
 * its parameter range, the direction, step options and stop conditions). One schema for the
 * browser form, the server (stored with the run, re-used by verification) and the CLI.
 */
import { z } from 'zod'

/** Path kinds on the lattice (torus patterns), on the wings (plane patterns) and on the phases. */
export const LATTICE_PATH_KINDS = ['shear', 'stretch', 'angle', 'interpolate', 'tau-polyline'] as const
export const PLANE_PATH_KINDS = ['wing-rotation'] as const
export const PHASE_PATH_KINDS = ['alpha1', 'alpha2', 'alpha-line', 'weight-scale'] as const
export const FAMILY_PATH_KINDS = [...LATTICE_PATH_KINDS, ...PLANE_PATH_KINDS, ...PHASE_PATH_KINDS] as const
export type FamilyPathKind = (typeof FAMILY_PATH_KINDS)[number]

const vec2 = z.tuple([z.number().finite(), z.number().finite()])
const ids = z.array(z.string().min(1)).min(1)

/** The path through parameter space; λ is documented per kind. */
export const FamilyPathSchema = z.discriminatedUnion('kind', [
  z.strictObject({ kind: z.literal('shear') }).describe('λ = s, ω2 = ω2⁰ + s·ω1⁰, ω1 fixed; starts at 0'),
  z.strictObject({ kind: z.literal('stretch') }).describe('λ = Im τ (τ = ω2/ω1), Re τ and ω1 fixed; starts at Im τ⁰'),
  z.strictObject({ kind: z.literal('angle') }).describe('λ = angle of ω2 in radians, |ω2| and ω1 fixed; starts at the angle of ω2⁰'),
  z.strictObject({ kind: z.literal('interpolate'), target: z.strictObject({ w1: vec2, w2: vec2 }) })
    .describe('λ = t, ω = (1 − t)·ω⁰ + t·target; starts at 0, reaches the target lattice at 1'),
  z.strictObject({ kind: z.literal('tau-polyline'), points: z.array(vec2).min(1) })
    .describe('λ ∈ [0, k]: τ runs along the polyline τ⁰ → points[0] → … → points[k−1] (one unit of λ per segment), ω1 fixed'),
  z.strictObject({ kind: z.literal('wing-rotation'), rotate: ids, compensate: ids })
    .describe('plane: λ = angle by which the wings `rotate` turn; the wings `compensate` turn by an unknown angle μ solved with the positions (see shared/families/README.md); both sets must sum to zero'),
  z.strictObject({ kind: z.literal('alpha1') }).describe('λ = α1; starts at the document α1'),
  z.strictObject({ kind: z.literal('alpha2') }).describe('λ = α2; starts at the document α2'),
  z.strictObject({ kind: z.literal('alpha-line'), direction: vec2 }).describe('λ = t, α = α⁰ + t·direction; starts at 0'),
  z.strictObject({ kind: z.literal('weight-scale'), edges: ids }).describe('λ = s, K_e = s·K_e⁰ on the listed edges; starts at 1'),
])
export type FamilyPath = z.infer<typeof FamilyPathSchema>

/** Step options of the pseudo-arclength engine (defaults in shared/continuation/options.ts). */
export const FamilyStepSchema = z.strictObject({
  initial: z.number().positive().optional().describe('first arclength step (default 0.05)'),
  min: z.number().positive().optional().describe('smallest step before giving up (default 1e-8)'),
  max: z.number().positive().optional().describe('largest step (default 0.5)'),
  maxNewtonIterations: z.number().int().min(1).optional().describe('Newton iterations per step (default 10)'),
  chord: z.boolean().optional().describe('chord Newton: reuse the previous point’s factorisation in the corrector instead of one per iteration (default true)'),
})

/** When the run stops. */
export const FamilyStopSchema = z.strictObject({
  maxPoints: z.number().int().min(1).default(500).describe('stop after this many points'),
  collapseTolerance: z.number().positive().lt(1).default(1e-3).describe('collapse when the shortest edge is below this fraction of the mean edge length'),
  orderFlip: z.boolean().default(true).describe('watch the cyclic order at every vertex'),
  stopAtEvents: z.boolean().default(true).describe('collapse, order flip and lattice degeneracy end the run (the construction fails there)'),
  stopAtSpecialPoint: z.boolean().default(false).describe('also stop at the first fold, branch point or rigidity loss'),
  locateTolerance: z.number().positive().default(1e-9).describe('relative tolerance in λ when locating special points'),
})

/** One complete family run description. */
export const FamilySettingsSchema = z.strictObject({
  path: FamilyPathSchema,
  to: z.number().finite().describe('target value of λ: the run ends with a "bound" point there'),
  direction: z.enum(['increase', 'decrease']).optional().describe('initial direction in λ (default: towards `to`)'),
  balanceFirst: z.boolean().default(true).describe('balance the drawing (or the phases) at the start value before continuing'),
  allowSingularStart: z.boolean().optional().describe('start even where F_u is singular at the start (a start that is not rigid: the family need not be locally unique there); default false'),
  step: FamilyStepSchema.default({}),
  stop: FamilyStopSchema.default({ maxPoints: 500, collapseTolerance: 1e-3, orderFlip: true, stopAtEvents: true, stopAtSpecialPoint: false, locateTolerance: 1e-9 }),
})
/** Settings as stored (defaults filled). */
export type FamilySettings = z.infer<typeof FamilySettingsSchema>
/** Settings as written by a user (defaults optional). */
export type FamilySettingsInput = z.input<typeof FamilySettingsSchema>

/** Parses settings; throws an Error listing every problem. */
export function parseFamilySettings(input: unknown): FamilySettings {
  const r = FamilySettingsSchema.safeParse(input)
  if (!r.success) throw new Error(`invalid family settings: ${r.error.issues.map(i => `${i.path.join('.') || '(root)'}: ${i.message}`).join('; ')}`)
  return r.data
}
