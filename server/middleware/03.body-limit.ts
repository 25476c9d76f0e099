/**
 * Read every request body here, counting bytes as they arrive, and answer 413 as soon as it
 * passes its limit (server/utils/body-limits.ts), whether it announced a Content-Length or came
 * chunked. The bytes read are handed to h3 (`event._requestBody`), so handlers read the body as
 * usual and never see more than the limit. Streamed uploads (STREAMED_UPLOADS) limit themselves.
 */
import type { H3Event } from 'h3'

const WITH_BODY = new Set(['POST', 'PUT', 'PATCH', 'DELETE'])

function tooLarge(limit: { bytes: number, why: string }) {
  return httpError(413, 'body_too_large',
    `Request bodies here are limited to ${(limit.bytes / 1e6).toFixed(1)} MB (${limit.why}); this one is larger.`)
}

function readLimited(event: H3Event, limit: { bytes: number, why: string }): Promise<Buffer> {
  const req = event.node.req
  return new Promise((resolve, reject) => {
    const chunks: Buffer[] = []
    let size = 0
    const onData = (chunk: Buffer) => {
      size += chunk.length
      if (size > limit.bytes) {
        req.off('data', onData)
        chunks.length = 0
        // The rest is discarded as it arrives (never kept); the answer goes out now.
        req.resume()
        reject(tooLarge(limit))
        return
      }
      chunks.push(chunk)
    }
    req.on('data', onData)
    req.once('end', () => resolve(Buffer.concat(chunks)))
    req.once('error', reject)
  })
}

export default defineEventHandler(async (event) => {
  if (!WITH_BODY.has(event.method) || streamedUploadFor(event.method, event.path)) return
  const headers = event.node.req.headers
  const declared = Number(headers['content-length'] ?? 0)
  if (!declared && headers['transfer-encoding'] === undefined) return
  const limit = bodyLimitFor(event.method, event.path)
  if (declared > limit.bytes) throw tooLarge(limit)
  ;(event as unknown as { _requestBody?: Buffer })._requestBody = await readLimited(event, limit)
})
