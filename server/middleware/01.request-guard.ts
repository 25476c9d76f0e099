/**
 * Cross-site request defence for every state-changing request (not GET/HEAD/OPTIONS):
 * - unless it carries `Authorization: Bearer …` (API tokens are not sent by browsers on their
 *   own), its `Origin` — or, when absent, the origin of its `Referer` — must be the app's own:
 *   the public origin (`public.baseUrl`) or the origin the request was addressed to. Anything
 *   else is 403. A request with neither header (a script, not a browser form) passes; the
 *   session cookie is SameSite=Lax on top of this (OWASP CSRF Prevention Cheat Sheet, "Verifying
 *   origin with standard headers");
 * - every API route reads JSON: a body of any other content type is 415, so a cross-site HTML
 *   form (which cannot send application/json) never reaches a handler. The one exception is the
 *   documented streamed uploads of server/utils/body-limits.ts (a project archive as application/zip).
 */
const SAFE = new Set(['GET', 'HEAD', 'OPTIONS'])

function originOf(value: string | undefined): string | null {
  if (!value) return null
  try { return new URL(value).origin }
  catch { return 'invalid' }
}

export default defineEventHandler((event) => {
  if (SAFE.has(event.method)) return
  const headers = event.node.req.headers
  if (!/^Bearer\s/i.test(headers.authorization ?? '')) {
    const claimed = headers.origin !== undefined ? (headers.origin === 'null' ? 'null' : originOf(headers.origin)) : originOf(headers.referer)
    if (claimed !== null) {
      const own = [originOf(useRuntimeConfig().public.baseUrl), getRequestURL(event).origin]
      if (!own.includes(claimed)) throw httpError(403, 'foreign_origin',
        'This request came from another site and was refused.')
    }
  }
  const hasBody = Number(headers['content-length'] ?? 0) > 0 || headers['transfer-encoding'] !== undefined
  const type = headers['content-type'] ?? ''
  const streamed = streamedUploadFor(event.method, event.path)
  if (hasBody && !/^application\/([\w.+-]+\+)?json\s*(;|$)/i.test(type) && !streamed?.contentType.test(type)) {
    throw httpError(415, 'unsupported_media_type', 'Send the body as JSON (Content-Type: application/json).')
  }
})
