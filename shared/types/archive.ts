/** Project archives: the manifest, the upload limits and the import answer (shared by route and page). */
import { z } from 'zod'
import { PROJECT_ROLES } from './roles'

/** `format` field of every archive manifest. */
export const ARCHIVE_FORMAT = 'wingfold-project-archive'
/** Layout version of the archive itself (entries and their meaning), independent of the DB schema. */
export const ARCHIVE_FORMAT_VERSION = 1

export const archiveManifestSchema = z.object({
  format: z.literal(ARCHIVE_FORMAT),
  formatVersion: z.number().int().positive(),
  appVersion: z.string(),
  /** Number of drizzle migrations of the exporting server and the last one's tag. */
  schema: z.object({ version: z.number().int().nonnegative(), tag: z.string() }),
  createdAt: z.string(),
  project: z.object({ name: z.string(), description: z.string() }),
  counts: z.record(z.string(), z.number().int().nonnegative()),
  files: z.array(z.object({ path: z.string(), bytes: z.number().int().nonnegative(), sha256: z.string().regex(/^[0-9a-f]{64}$/) })),
})
export type ArchiveManifest = z.infer<typeof archiveManifestSchema>

/** A person named in an archive: an opaque reference, a name, and the project role (null: author only). */
export const archivePersonSchema = z.object({ ref: z.number().int(), name: z.string(), role: z.enum(PROJECT_ROLES).nullable() })
export type ArchivePerson = z.infer<typeof archivePersonSchema>

/** What the import answers: the new project, what it holds, and the people to invite. */
export interface ArchiveImportResult {
  project: { id: number, name: string }
  counts: Record<string, number>
  runs: { verified: number, rejected: number, pending: number }
  maps: { verified: number, rejected: number, pending: number }
  /** Members of the exported project, offered as invitations (the archive holds no addresses). */
  members: Array<{ name: string, role: (typeof PROJECT_ROLES)[number] }>
}
