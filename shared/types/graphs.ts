/** Payload schemas for a project's gluing patterns (graphs) and their saved versions. */
import { z } from 'zod'
import { PatternDocumentSchema } from './pattern'
import { projectParamsSchema } from './projects'

/** Largest accepted request body for a pattern upload or save (bytes). */
export const MAX_PATTERN_BYTES = 2_000_000

const message = z.string().trim().max(500, { message: 'Use at most 500 characters.' })

/** POST /api/projects/[id]/graphs: a new pattern with its first version. */
export const graphCreateSchema = z.object({
  name: z.string().trim().min(1, { message: 'Give the pattern a name.' }).max(200, { message: 'Use at most 200 characters.' }),
  description: z.string().trim().max(2000, { message: 'Use at most 2000 characters.' }).default(''),
  /** The document: shape-checked here, cross-checked by `parsePatternDocument` in the route. */
  document: PatternDocumentSchema,
  message: message.default('First version'),
})
export type GraphCreatePayload = z.input<typeof graphCreateSchema>

/** POST …/graphs/[graphId]/versions: save the document as a new version. */
export const graphSaveSchema = z.object({
  document: PatternDocumentSchema,
  message: message.min(1, { message: 'Say in a few words what changed.' }),
})
export type GraphSavePayload = z.input<typeof graphSaveSchema>

/** POST …/versions/[version]/restore: optional message for the new version. */
export const graphRestoreSchema = z.object({ message: message.optional() })

/** Route parameters of /api/projects/[id]/graphs/[graphId] */
export const graphParamsSchema = projectParamsSchema.extend({ graphId: z.coerce.number().int().positive() })

/** Route parameters of /api/projects/[id]/graphs/[graphId]/versions/[version] */
export const graphVersionParamsSchema = graphParamsSchema.extend({ version: z.coerce.number().int().positive() })

/** One saved version in a list (without its document). */
export interface GraphVersionItem {
  version: number
  message: string
  authorName: string | null
  summary: Record<string, unknown> | null
  createdAt: string
}

/** A pattern with one version's document and every version's list entry. */
export interface GraphDetail {
  id: number
  projectId: number
  name: string
  description: string
  latestVersion: number
  /** The version whose document is included. */
  version: number
  document: unknown
  summary: Record<string, unknown> | null
  versions: GraphVersionItem[]
}
