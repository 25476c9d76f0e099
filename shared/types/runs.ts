/**
 * Payloads of the run routes: creating a run, appending batches of points, finishing,
 * renaming, listing with filters, importing an exported run and comparing runs. One schema per
 * payload, used by the routes and the forms.
 */
import { z } from 'zod'
import { FAMILY_PATH_KINDS, FamilySettingsSchema } from './family'
import { RUN_STATUSES, VERIFICATION_STATES } from './roles'

/** Route parameter `runId` of /api/runs/[runId]/… */
export const runRouteParamsSchema = z.object({ runId: z.coerce.number().int().positive() })

const finite = z.number().finite()
const vector = z.array(finite).max(200_000)

/** Largest number of points (regular + special) one append may carry. */
export const MAX_POINTS_PER_BATCH = 500

/** A regular point as the browser sends it (the engine's ContinuationPoint, plain JSON). */
export const RunPointSchema = z.object({
  index: z.number().int().min(0),
  lambda: finite,
  u: vector,
  tangent: vector.default([]),
  stepSize: finite.default(0),
  nextStepSize: finite.default(0),
  arclength: finite.default(0),
  newtonIterations: z.number().int().min(0).default(0),
  residualNorm: finite.default(0),
  sigmaMin: finite.optional(),
  tests: z.record(z.string(), z.unknown()).optional(),
  diagnostics: z.record(z.string(), finite).optional(),
})
export type RunPointPayload = z.input<typeof RunPointSchema>

/** A special point (the engine's SpecialPoint, plain JSON; `kind` in plain words). */
export const RunSpecialPointSchema = z.object({
  index: z.number().int().min(0),
  kind: z.string().trim().min(1).max(60),
  label: z.string().max(300).default(''),
  afterPoint: z.number().int().min(0),
  lambda: finite,
  u: vector,
  tangent: vector.default([]),
  kernel: vector.optional(),
  precision: finite.default(0),
  located: z.boolean().default(false),
  iterations: z.number().int().min(0).default(0),
  /** A collapse located at length 0: where the run stopped (the tolerance crossing). */
  stoppedAt: z.object({ lambda: finite }).optional(),
})
export type RunSpecialPointPayload = z.input<typeof RunSpecialPointSchema>

/** POST /api/runs/[runId]/points: one batch. */
export const runBatchSchema = z.object({
  points: z.array(RunPointSchema).default([]),
  specialPoints: z.array(RunSpecialPointSchema).default([]),
}).refine(b => b.points.length + b.specialPoints.length <= MAX_POINTS_PER_BATCH, { message: `At most ${MAX_POINTS_PER_BATCH} points per batch.` })
export type RunBatchPayload = z.input<typeof runBatchSchema>

/** POST /api/projects/[id]/runs: a new run on one version of a pattern. */
export const runCreateSchema = z.object({
  graphId: z.number().int().positive(),
  /** Version number of the pattern; default its newest. */
  version: z.number().int().positive().optional(),
  name: z.string().trim().min(1, { message: 'Give the run a name.' }).max(120, { message: 'Use at most 120 characters.' }),
  settings: FamilySettingsSchema,
  /** A restart: the run and the point it continues from. */
  parentRunId: z.number().int().positive().optional(),
  /** The parent's point: a regular point's index (≥ 0), or −1 − k for its special point k (the storage rule). */
  restartPointIndex: z.number().int().optional(),
})
export type RunCreatePayload = z.input<typeof runCreateSchema>

/** Final states a browser may report. */
export const RUN_END_STATES = ['complete', 'stopped', 'cancelled', 'failed'] as const

/** POST /api/runs/[runId]/finish. */
export const runFinishSchema = z.object({
  status: z.enum(RUN_END_STATES),
  reason: z.string().max(1000).default(''),
})

/** PATCH /api/runs/[runId]: rename. */
export const runRenameSchema = z.object({ name: runCreateSchema.shape.name })

/** Sortable columns of the run library. */
export const RUN_SORT_KEYS = ['createdAt', 'name', 'pointCount', 'specialCount', 'status'] as const

/** GET /api/projects/[id]/runs query: filters and sort. */
export const runListQuerySchema = z.object({
  graphId: z.coerce.number().int().positive().optional(),
  kind: z.enum(FAMILY_PATH_KINDS).optional(),
  status: z.enum(RUN_STATUSES).optional(),
  verification: z.enum(VERIFICATION_STATES).optional(),
  authorId: z.coerce.number().int().positive().optional(),
  /** ISO dates (inclusive day bounds). */
  from: z.string().date().optional(),
  to: z.string().date().optional(),
  sort: z.enum(RUN_SORT_KEYS).default('createdAt'),
  order: z.enum(['asc', 'desc']).default('desc'),
})
export type RunListQuery = z.input<typeof runListQuerySchema>

/** Largest page of regular points one GET /api/runs/[runId]/points answers. */
export const MAX_POINTS_PER_PAGE = 2000

/** GET /api/runs/[runId]/points query: a page of regular points. */
export const runPointsQuerySchema = z.object({
  offset: z.coerce.number().int().min(0).default(0),
  limit: z.coerce.number().int().min(1).max(MAX_POINTS_PER_PAGE).default(500),
})

/** GET /api/compare?runs=1,2,3 */
export const compareQuerySchema = z.object({
  runs: z.string().regex(/^\d+(,\d+)*$/, { message: 'Give run ids separated by commas.' })
    .transform(s => [...new Set(s.split(',').map(Number))])
    .refine(a => a.length <= 8, { message: 'Compare at most 8 runs.' }),
})

/** The export format tag of a run file (JSON export / import). */
export const RUN_EXPORT_FORMAT = 'wingfold-run'

/** POST /api/projects/[id]/runs/import: a JSON export of a run, attached to a pattern of this project. */
export const runImportSchema = z.object({
  graphId: z.number().int().positive(),
  version: z.number().int().positive().optional(),
  name: z.string().trim().min(1).max(120).optional(),
  run: z.object({
    format: z.literal(RUN_EXPORT_FORMAT),
    name: z.string().max(120),
    settings: FamilySettingsSchema,
    status: z.enum(RUN_STATUSES).optional(),
    finishReason: z.string().max(1000).nullable().optional(),
    points: z.array(RunPointSchema).max(100_000),
    specialPoints: z.array(RunSpecialPointSchema).max(10_000).default([]),
  }).passthrough(),
})
export type RunImportPayload = z.input<typeof runImportSchema>

/** The caution every export carries. */
export const RESULT_CAUTION = 'These results are numerical evidence, not proofs, and no assessment of any manufactured part.'

/** A run in the library list and on the compare page. */
export interface RunSummary {
  id: number
  projectId: number
  projectName?: string
  graphId: number
  graphName: string
  graphVersion: number
  name: string
  pathKind: string
  status: (typeof RUN_STATUSES)[number]
  verification: (typeof VERIFICATION_STATES)[number]
  verificationReason: string | null
  /** Definition of vertical balance the verification used ('cuts-v1'); null: the earlier vertex-sum definition. */
  verticalBalance: string | null
  /** Why the run ended, as the browser reported it (e.g. "stopped: no convergence past λ = …"). */
  finishReason: string | null
  pointCount: number
  specialCount: number
  authorId: number | null
  authorName: string | null
  parentRunId: number | null
  restartPointIndex: number | null
  appVersion: string
  createdAt: string
  updatedAt: string
}

/** One run with what is needed to reproduce it: the settings and the pattern document. */
export interface RunDetail extends RunSummary {
  settings: z.infer<typeof FamilySettingsSchema>
  document: unknown
  role: 'viewer' | 'editor' | 'owner'
}

/** A stored point (regular or special) as the routes return it. */
export interface StoredRunPoint {
  index: number
  lambda: number
  /** Residual max|F| recomputed by the server when the point was saved. */
  residual: number
  specialKind: string | null
  state: Record<string, unknown> & { u: number[] }
  diagnostics: Record<string, number>
}

/** GET /api/projects/[id]/runs/source: what a new run starts from. */
export interface RunSource {
  graphId: number
  graphName: string
  version: number
  document: import('./pattern').PatternDocument
  summary: Record<string, unknown> | null
}
