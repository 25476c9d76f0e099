/**
 * Settings of the schematic surface and of its relaxation, with documented defaults and one
 * validation (zod, shared by the worker, the CLI and the view's form).
 *
 * Units: the surface unit is chosen so that the vertical period is 2π (the towers' own unit);
 * the pattern's horizontal coordinates are scaled so that its shortest closed edge is
 * `edgeLength` surface units. Near the limit of the gluing construction edges are long compared
 * with the towers (whose wings are flat a few units from the axis).
 */
import { z } from 'zod'

export const surfaceSettingsSchema = z.object({
  /** Mesh rows per vertical period (even, ≥ 8). */
  rows: z.number().int().min(8).max(256).refine(n => n % 2 === 0, 'rows must be even').default(24),
  /** Columns on each side of a tower sector's middle. */
  radial: z.number().int().min(2).max(64).default(5),
  /** Where a tower's core ends along each wing (|u| ≤ cutoff in the tower's conjugate coordinate, ≈ the distance along the wing). */
  cutoff: z.number().positive().max(20).default(2.5),
  /** Length of the shortest closed edge, in surface units (vertical period 2π). */
  edgeLength: z.number().positive().max(1e4).default(4 * Math.PI),
  /** Plane patterns: open wings are cut this far from their tower (surface units). */
  wingLength: z.number().positive().max(1e4).default(4 * Math.PI),
  /** Target spacing of sheet columns along an edge, as a multiple of the row spacing 2π/rows. */
  sheetSpacing: z.number().positive().max(20).default(1.5),
})

/** Settings after defaults were filled. */
export type SurfaceSettings = z.output<typeof surfaceSettingsSchema>
/** Settings as a caller may give them (every field optional). */
export type SurfaceSettingsInput = z.input<typeof surfaceSettingsSchema>

/** Fill defaults and reject nonsense (throws a ZodError with readable messages). */
export function parseSurfaceSettings(input: unknown = {}): SurfaceSettings {
  return surfaceSettingsSchema.parse(input ?? {})
}

export const relaxSettingsSchema = z.object({
  /** Pinkall–Polthier steps at most. */
  maxIterations: z.number().int().min(1).max(1000).default(40),
  /** Stop when no vertex moved more than this times the mean edge length in one step. */
  tolerance: z.number().positive().max(1).default(1e-4),
  /**
   * Keep only the normal part of every step (default): the plain iteration also slides vertices
   * along the surface, slowly and without end on an irregular mesh, which changes the mesh, not
   * the surface.
   */
  normalOnly: z.boolean().default(true),
  /** Also stop, converged, when the largest |H|·L is below this. */
  curvatureTolerance: z.number().min(0).max(1).default(2e-3),
  /** Stop when the mean |H| has not improved for this many steps (and keep the best step). */
  patience: z.number().int().min(1).max(100).default(4),
})

export type RelaxSettings = z.output<typeof relaxSettingsSchema>
export type RelaxSettingsInput = z.input<typeof relaxSettingsSchema>

export function parseRelaxSettings(input: unknown = {}): RelaxSettings {
  return relaxSettingsSchema.parse(input ?? {})
}
