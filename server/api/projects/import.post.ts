import type { ArchiveImportResult } from '#shared/types/archive'

/**
 * Import a project archive (the zip of GET /api/projects/:id/archive) as a new project owned by
 * the caller. A documented NON-JSON upload: the body is the zip itself (`application/zip`), read
 * as a stream and limited while it is read (`NUXT_ARCHIVE_IMPORT_MAX_MB`, default 64; see
 * docs/archives.md). Everything is checked and every run and map re-verified before one write
 * transaction; a refusal (4xx) names what failed and writes nothing.
 */
export default defineEventHandler(async (event): Promise<ArchiveImportResult> => {
  const user = await requireUser(event)
  const type = getRequestHeader(event, 'content-type') ?? ''
  if (!/^application\/(zip|x-zip-compressed|octet-stream)\b/.test(type)) throw httpError(415, 'archive_content_type',
    'Send the archive as the request body with Content-Type: application/zip.')
  const limits = archiveLimits()
  // a refusal before the whole body was read closes the connection, so the client does not reuse a
  // socket with unread bytes
  const unread = (e: unknown) => { if (!event.node.req.readableEnded) setResponseHeader(event, 'connection',
    'close'); return e }
  const declared = Number(getRequestHeader(event, 'content-length') ?? 0)
  if (declared > limits.maxUploadBytes) throw unread(archiveRefusal(413, 'archive_too_large',
    `The upload is larger than ${limits.maxUploadBytes} bytes (runtime config archiveImport.maxMb).`))
  const entries = await readArchiveStream(event.node.req, limits).catch((e) => { throw unread(e) })
  const parsed = parseArchive(entries)
  const verdicts = verifyArchive(parsed)
  const result = await writeArchive(parsed, verdicts, user)
  setResponseStatus(event, 201)
  return result
})
