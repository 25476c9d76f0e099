/**
 * Census API payloads (zod): starting a census job, the job and pattern rows, and the pattern
 * list's filters and sort. Bounds are capped so one job stays within what a server can do in
 * minutes (see bench/census.ts for the measured growth).
 */
import { z } from 'zod'
import type { CensusPattern } from '../census/enumerate'

export const CENSUS_JOB_STATUSES = ['queued', 'running', 'cancelling', 'cancelled', 'interrupted', 'done', 'failed'] as const
export type CensusJobStatus = (typeof CENSUS_JOB_STATUSES)[number]
/** Where a job runs: in the web server's process, or on BullMQ workers. */
export const CENSUS_QUEUES = ['in-process', 'bullmq'] as const

export const CENSUS_MAX_TOWERS = 6
export const CENSUS_MAX_HALF_EDGES = 24

const Vec2 = z.tuple([z.number().finite(), z.number().finite()])

/** POST /api/census/jobs */
export const censusJobCreateSchema = z.strictObject({
  maxTowers: z.number().int().min(1).max(CENSUS_MAX_TOWERS),
  maxHalfEdges: z.number().int().min(2).max(CENSUS_MAX_HALF_EDGES),
  lattice: z.strictObject({ w1: Vec2, w2: Vec2 }).refine(l => l.w1[0] * l.w2[1] - l.w1[1] * l.w2[0] > 0, 'the lattice needs det(w1, w2) > 0').optional(),
  searchTau: z.boolean().default(true),
})
export type CensusJobCreate = z.infer<typeof censusJobCreateSchema>

export const censusJobParamsSchema = z.object({ id: z.coerce.number().int().positive() })

export const CENSUS_SORT_KEYS = ['towers', 'edges', 'predictedGenus', 'automorphisms', 'balanced', 'rigid', 'id'] as const

const boolText = z.enum(['true', 'false']).transform(v => v === 'true')

/** GET /api/census/patterns query. */
export const censusPatternQuerySchema = z.object({
  towers: z.coerce.number().int().min(1).optional(),
  genus: z.coerce.number().int().min(0).optional(),
  degrees: z.string().regex(/^\d+(,\d+)*$/).optional(),
  balanced: boolText.optional(),
  rigid: boolText.optional(),
  chiral: boolText.optional(),
  sort: z.enum(CENSUS_SORT_KEYS).default('id'),
  order: z.enum(['asc', 'desc']).default('asc'),
  limit: z.coerce.number().int().min(1).max(500).default(200),
  offset: z.coerce.number().int().min(0).default(0),
})
export type CensusPatternQuery = z.infer<typeof censusPatternQuerySchema>

/** A census job as the API returns it. */
export interface CensusJobView {
  id: number
  status: CensusJobStatus
  queue: (typeof CENSUS_QUEUES)[number]
  maxTowers: number
  maxHalfEdges: number
  visited: number
  found: number
  classified: number
  error: string | null
  createdAt: string
  finishedAt: string | null
}

/** A census pattern row as the API returns it (without its document and σ). */
export type CensusPatternView = Omit<CensusPattern, 'sigma'> & {
  id: number
  balanced: boolean
  reason: string | null
  rigid: boolean | null
  phaseKernelDimension: number | null
  tau: [number, number]
}
