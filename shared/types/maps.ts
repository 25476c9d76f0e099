/**
 * Moduli map settings and results: a grid over the τ plane (τ = ω2/ω1, lattice scale fixed by
 * the cell area or by |ω1|) or over the (α1, α2) plane, solved row by row by continuation from a
 * seed. One schema for the browser, the server (stored with the map, re-used by verification)
 * and the CLI.
 */
import { z } from 'zod'

/** The two planes a map can cover. */
export const MAP_PLANES = ['tau', 'alpha'] as const
export type MapPlane = (typeof MAP_PLANES)[number]

/** How the lattice scale is fixed in the τ plane. */
export const MAP_SCALE_MODES = ['area', 'w1'] as const

/** Quantities a cell records (the heat map shows one of them). */
export const MAP_QUANTITIES = ['sigmaMin', 'negativeEigenvalues', 'minEdgeRatio', 'lengthPerRootArea', 'minCos'] as const
export type MapQuantity = (typeof MAP_QUANTITIES)[number]

/** How each quantity is named on screen (colour-by choice, scale caption). */
export const MAP_QUANTITY_LABELS: Record<MapQuantity, string> = {
  sigmaMin: 'rigidity margin σ_min [dimensionless]', negativeEigenvalues: 'negative eigenvalues of F_u [count]',
  minEdgeRatio: 'min edge / mean edge [dimensionless]', lengthPerRootArea: 'total length / √area [dimensionless]', minCos: 'smallest cos φ [dimensionless]',
}

/**
 * A map quantity's name and unit. The rigidity margin is the one runs record too: the rigidity
 * verdict's σ_min with the trivial motions removed, × ℓ̄ (τ plane) or ÷ K̄ (α plane).
 */
export function mapQuantityLabel(q: MapQuantity, _plane: 'tau' | 'alpha'): string {
  return MAP_QUANTITY_LABELS[q]
}

/** Largest number of values on one axis (a 201 × 201 map has 40 401 cells). */
export const MAP_AXIS_MAX_COUNT = 201

/** One axis: `count` equally spaced values from `min` to `max` (both included). */
export const MapAxisSchema = z.strictObject({
  min: z.number().finite(),
  max: z.number().finite(),
  count: z.number().int().min(1).max(MAP_AXIS_MAX_COUNT),
}).refine(a => a.count === 1 || a.max > a.min, { message: 'max must exceed min when count > 1' })
export type MapAxis = z.infer<typeof MapAxisSchema>

/** Everything needed to reproduce a map. */
export const MapSettingsSchema = z.strictObject({
  plane: z.enum(MAP_PLANES).describe("'tau': x = Re τ, y = Im τ; 'alpha': x = α1, y = α2"),
  x: MapAxisSchema.describe('columns (Re τ or α1)'),
  y: MapAxisSchema.describe('rows (Im τ or α2)'),
  scaleBy: z.enum(MAP_SCALE_MODES).default('area').describe("τ plane: keep the cell area ('area') or |ω1| ('w1') of the document"),
  seed: z.tuple([z.number().finite(), z.number().finite()]).optional().describe('start point (x, y); default: the document τ or α'),
  collapseTolerance: z.number().positive().lt(1).default(1e-3).describe('a row ends when the shortest edge is below this fraction of the mean'),
  orderFlip: z.boolean().default(true).describe('a row ends when two half-edges at a vertex swap their cyclic order'),
  maxStep: z.number().positive().optional().describe('largest arclength step (default: the grid spacing)'),
  maxPointsPerRow: z.number().int().min(10).default(5000).describe('continuation points per half row before giving up'),
}).superRefine((s, ctx) => {
  if (s.plane === 'tau' && s.y.min <= 0) ctx.addIssue({ code: 'custom', path: ['y', 'min'], message: 'Im τ must be positive' })
  if (s.plane === 'tau' && s.seed && s.seed[1] <= 0) ctx.addIssue({ code: 'custom', path: ['seed'], message: 'the seed needs Im τ > 0' })
})
/** Settings as stored (defaults filled). */
export type MapSettings = z.infer<typeof MapSettingsSchema>
export type MapSettingsInput = z.input<typeof MapSettingsSchema>

/** Parses map settings; throws an Error listing every problem. */
export function parseMapSettings(input: unknown): MapSettings {
  const r = MapSettingsSchema.safeParse(input)
  if (!r.success) throw new Error(`invalid map settings: ${r.error.issues.map(i => `${i.path.join('.') || '(root)'}: ${i.message}`).join('; ')}`)
  return r.data
}

/** The values of an axis. */
export function axisValues(a: MapAxis): number[] {
  if (a.count === 1) return [a.min]
  return Array.from({ length: a.count }, (_, k) => a.min + (a.max - a.min) * k / (a.count - 1))
}

/** One grid cell. Unreachable cells carry `endedBy` (why continuation did not get there). */
export interface MapCell {
  /** Row (y index) and column (x index). */
  i: number
  j: number
  x: number
  y: number
  status: 'solved' | 'unreachable'
  /** Dimensionless σ_min of F_u (× mean edge length for drawings, ÷ mean weight for phases). */
  sigmaMin?: number
  /** Negative eigenvalues of F_u (LDLᵀ inertia); absent when LU replaced LDLᵀ. */
  negativeEigenvalues?: number
  /** Shortest edge / mean edge (drawings). */
  minEdgeRatio?: number
  /** Total length / √(cell area) (drawings). */
  lengthPerRootArea?: number
  /** Smallest cos φ_e (phases). */
  minCos?: number
  /** max|F| at the cell and the λ the engine located (x, up to the locate tolerance). */
  residualNorm?: number
  lambda?: number
  /** The state (positions of vertices 1..V−1, or phases 1..V−1): restart and verification. */
  u?: number[]
  /**
   * For unsolved cells: a degeneration met on the way from a solved cell ("collapse", "order
   * flip", "lattice degeneracy", "fold"), "no convergence", or {@link NOT_REACHED}.
   */
  endedBy?: string
}

/** endedBy of a cell no continuation from a solved cell got to (shared/maps/fill.ts). */
export const NOT_REACHED = 'unreachable from the seed'

/** Events past which an unsolved cell is "past a degeneration" rather than unreachable from the seed. */
export const DEGENERATIONS: readonly string[] = ['collapse', 'order flip', 'lattice degeneracy', 'fold']

/** True for an unsolved cell that lies past a degeneration met on the way from a solved cell. */
export function pastDegeneration(c: Pick<MapCell, 'status' | 'endedBy'>): boolean {
  return c.status !== 'solved' && DEGENERATIONS.includes(c.endedBy ?? '')
}

/** A special point met while sweeping (rigidity loss, branch point, or the event ending a half row). */
export interface MapCrossing { kind: string; x: number; y: number; along: 'row' | 'column'; lambda: number; u: number[] }

/** One row: its cells and how each half (towards smaller / larger x) ended. */
export interface MapRow {
  i: number
  y: number
  cells: MapCell[]
  endedLeft?: string
  endedRight?: string
  crossings: MapCrossing[]
}

/** The state at the spine cell of a row: where that row's continuation starts. */
export interface MapRowStart { i: number; y: number; u?: number[]; endedBy?: string }

/** A whole map. */
export interface MapResult {
  settings: MapSettings
  xs: number[]
  ys: number[]
  /** Column of the spine (the column continued from the seed). */
  spineColumn: number
  seed: [number, number]
  rows: MapRow[]
  /** Crossings found along the spine. */
  spineCrossings: MapCrossing[]
  /** Rows not computed (cancelled). */
  missingRows: number[]
}

const finite = z.number().finite()
const optFinite = finite.optional()

/** A cell as posted to the server. */
export const MapCellSchema = z.strictObject({
  i: z.number().int().min(0), j: z.number().int().min(0), x: finite, y: finite,
  status: z.enum(['solved', 'unreachable']),
  sigmaMin: optFinite, negativeEigenvalues: z.number().int().min(0).optional(), minEdgeRatio: optFinite,
  lengthPerRootArea: optFinite, minCos: optFinite, residualNorm: optFinite, lambda: optFinite,
  u: z.array(finite).max(20000).optional(), endedBy: z.string().max(200).optional(),
})

const CrossingSchema = z.strictObject({ kind: z.string().max(60), x: finite, y: finite, along: z.enum(['row', 'column']), lambda: finite, u: z.array(finite).max(20000) })

/** A traced curve as stored with a map. */
export const MapCurveSchema = z.strictObject({ kind: z.string().max(120), points: z.array(z.tuple([finite, finite])).max(20000) })
export type MapCurve = z.infer<typeof MapCurveSchema>

/** The result as posted (the server re-checks the grid against the settings). */
export const MapResultSchema = z.strictObject({
  settings: z.unknown(),
  xs: z.array(finite).max(MAP_AXIS_MAX_COUNT), ys: z.array(finite).max(MAP_AXIS_MAX_COUNT),
  spineColumn: z.number().int().min(0), seed: z.tuple([finite, finite]),
  rows: z.array(z.strictObject({
    i: z.number().int().min(0), y: finite, cells: z.array(MapCellSchema).max(MAP_AXIS_MAX_COUNT),
    endedLeft: z.string().max(200).optional(), endedRight: z.string().max(200).optional(), crossings: z.array(CrossingSchema).max(1000),
  })).max(MAP_AXIS_MAX_COUNT),
  spineCrossings: z.array(CrossingSchema).max(1000),
  missingRows: z.array(z.number().int().min(0)).max(MAP_AXIS_MAX_COUNT),
})

/** POST /api/projects/:id/maps. */
export const MapCreateSchema = z.strictObject({
  graphId: z.number().int().positive(),
  version: z.number().int().positive().optional(),
  name: z.string().trim().min(1).max(120),
  settings: MapSettingsSchema,
  result: MapResultSchema,
  curves: z.array(MapCurveSchema).max(50).default([]),
  wallMs: z.number().nonnegative().optional(),
  workers: z.number().int().min(1).max(256).optional(),
})
export type MapCreateInput = z.input<typeof MapCreateSchema>

/** Route parameters of /api/maps/:mapId. */
export const mapRouteParamsSchema = z.object({ mapId: z.coerce.number().int().positive() })

/** A saved map in lists (no cells). */
export interface MapSummary {
  id: number
  projectId: number
  name: string
  plane: MapPlane
  graphId: number
  graphName: string
  version: number
  cellCount: number
  solvedCount: number
  wallMs: number | null
  workers: number | null
  verification: 'pending' | 'verified' | 'rejected'
  verificationReason: string | null
  /** Definition of vertical balance the verification used ('cuts-v1'); null: the earlier vertex-sum definition. */
  verticalBalance: string | null
  authorName: string | null
  createdAt: string
}

/** A saved map with everything. */
export interface MapDetail extends MapSummary {
  settings: MapSettings
  result: MapResult
  curves: MapCurve[]
  document: unknown
}
