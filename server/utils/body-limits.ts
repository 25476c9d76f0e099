/**
 * Request body limits, enforced while the body is read (server/middleware/03.body-limit.ts), so
 * a chunked body without Content-Length is cut off too. Every route gets `bodyLimit.defaultBytes`
 * (NUXT_BODY_LIMIT_DEFAULT_BYTES, default 1 MB); the routes below take more, for the reasons
 * given (docs/security.md lists them).
 */
import { MAX_PATTERN_BYTES } from '#shared/types/graphs'

/** Larger limits: method, path pattern, bytes, why. */
export const BODY_LIMITS: ReadonlyArray<{ method: string, path: RegExp, bytes: number, why: string }> = [
  { method: 'POST', path: /^\/api\/projects\/[^/]+\/graphs$/, bytes: MAX_PATTERN_BYTES,
    why: 'a pattern document (2 MB limit of the format)' },
  { method: 'POST', path: /^\/api\/projects\/[^/]+\/graphs\/[^/]+\/versions$/, bytes: MAX_PATTERN_BYTES,
    why: 'a new version of a pattern document' },
  { method: 'POST', path: /^\/api\/runs\/[^/]+\/points$/, bytes: 8_000_000,
    why: 'a batch of up to 500 points with their state vectors' },
  { method: 'POST', path: /^\/api\/projects\/[^/]+\/runs\/import$/, bytes: 32_000_000,
    why: 'a whole exported run (document and every point)' },
  { method: 'POST', path: /^\/api\/projects\/[^/]+\/maps$/, bytes: 32_000_000,
    why: 'a computed map (every cell, crossing and traced curve)' },
]

/** The byte limit of a request, and what the route takes (for the 413 message). */
export function bodyLimitFor(method: string, path: string): { bytes: number, why: string } {
  const pathname = path.split('?')[0]!
  return BODY_LIMITS.find(l => l.method === method && l.path.test(pathname)) ?? { bytes: Number(useRuntimeConfig().bodyLimit.defaultBytes), why: 'the default for every route' }
}

/**
 * Uploads that are not JSON and are read as a stream by their handler, which enforces its own
 * limits while reading: the middleware neither buffers them nor refuses their content type.
 */
export const STREAMED_UPLOADS: ReadonlyArray<{ method: string, path: RegExp, contentType: RegExp, why: string }> = [
  {
    method: 'POST', path: /^\/api\/projects\/import$/, contentType: /^application\/(zip|x-zip-compressed|octet-stream)\b/i,
    why: 'a project archive (zip), limited while it streams by archiveImport.* (docs/archives.md)',
  },
]

/** The streamed upload a request is, if any. */
export function streamedUploadFor(method: string, path: string) {
  const pathname = path.split('?')[0]!
  return STREAMED_UPLOADS.find(u => u.method === method && u.path.test(pathname))
}
