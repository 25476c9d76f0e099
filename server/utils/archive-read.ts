/**
 * Reading an uploaded archive with limits enforced while the bytes arrive (fflate's streaming
 * `Unzip`): upload size, entry count, total inflated size, the inflated/read ratio (a zip bomb
 * inflates far more than it reads; archives of JSON rows stay well below 100:1), and entry names
 * (no absolute paths, no `..`, no backslashes or drive letters, no folders). Every refusal is a
 * clear 4xx naming what failed; nothing is written before the whole archive has been read.
 */
import { createError } from 'h3'
import { Unzip, UnzipInflate } from 'fflate'
/** Limits of one import (runtime config `archiveImport`, see archiveLimits in archive-import.ts). */
export interface ArchiveLimits { maxUploadBytes: number, maxEntries: number, maxTotalBytes: number, maxRatio: number }

/** A 4xx refusal of an archive with a machine code and the names of what failed. */
export function archiveRefusal(statusCode: number, code: string, message: string, problems: string[] = []) {
  return createError({ statusCode, message, data: { code, problems } })
}

/** Ratio checks start once this many bytes were inflated (small entries compress unevenly). */
const RATIO_FLOOR_BYTES = 1024 * 1024

/** Why an entry name is refused, or null when it is a plain relative file path. */
export function unsafeEntryName(name: string): string | null {
  if (!name || name.length > 200) return 'empty or too long name'
  if (name.endsWith('/')) return 'folder entry'
  if (name.startsWith('/') || /^[A-Za-z]:/.test(name)) return 'absolute path'
  if (name.includes('\\') || name.includes('\0')) return 'backslash or NUL in the name'
  if (name.split('/').some(part => part === '..' || part === '.' || part === '')) return 'path traversal'
  return null
}

/**
 * Inflate every entry of the zip read from `source` into memory (bounded by `limits`).
 * @returns entry name → bytes, in archive order
 */
export async function readArchiveStream(source: AsyncIterable<Uint8Array>,
  limits: ArchiveLimits): Promise<Map<string, Uint8Array>> {
  const entries = new Map<string, Uint8Array[]>()
  let failure: Error | null = null
  let read = 0, inflated = 0
  const fail = (e: Error) => { failure ??= e }
  const unzip = new Unzip()
  unzip.register(UnzipInflate)
  unzip.onfile = (file) => {
    if (failure) return
    const bad = unsafeEntryName(file.name)
    if (bad) return fail(archiveRefusal(422, 'archive_unsafe_entry',
      `The archive holds an entry that is not allowed: ${JSON.stringify(file.name)} (${bad}).`, [file.name]))
    if (entries.has(file.name)) return fail(archiveRefusal(422, 'archive_duplicate_entry',
      `The archive holds ${file.name} twice.`, [file.name]))
    if (entries.size + 1 > limits.maxEntries) return fail(archiveRefusal(413, 'archive_too_many_entries',
      `The archive holds more than ${limits.maxEntries} entries.`))
    const parts: Uint8Array[] = []
    entries.set(file.name, parts)
    file.ondata = (err, data) => {
      if (failure) return
      if (err) return fail(archiveRefusal(422, 'archive_corrupt',
        `The archive entry ${file.name} cannot be inflated: ${err.message}.`, [file.name]))
      inflated += data.length
      if (inflated > limits.maxTotalBytes) return fail(archiveRefusal(413, 'archive_too_large_inflated',
        `The archive inflates to more than ${limits.maxTotalBytes} bytes.`, [file.name]))
      if (inflated > RATIO_FLOOR_BYTES && inflated > limits.maxRatio * read) {
        return fail(archiveRefusal(413, 'archive_ratio',
          `The archive inflates more than ${limits.maxRatio} times its size (at ${file.name}); it looks like a zip bomb.`, [file.name]))
      }
      parts.push(data)
    }
    file.start()
  }
  try {
    // After a refusal the rest of the body is still read (and dropped) up to the upload limit:
    // leaving a `for await` early destroys the request, and the client would see a reset instead of the answer.
    for await (const chunk of source) {
      read += chunk.length
      if (read > limits.maxUploadBytes) throw failure ?? archiveRefusal(413, 'archive_too_large',
        `The upload is larger than ${limits.maxUploadBytes} bytes (runtime config archiveImport.maxMb).`)
      if (failure) continue
      try { unzip.push(chunk) } catch (e) { fail(archiveRefusal(422, 'archive_corrupt',
        `The upload is not a readable zip archive: ${(e as Error).message}.`)) }
    }
    if (failure) throw failure
    unzip.push(new Uint8Array(0), true)
  } catch (e) {
    if ((e as { statusCode?: number }).statusCode) throw e
    throw archiveRefusal(422, 'archive_corrupt', `The upload is not a readable zip archive: ${(e as Error).message}.`)
  }
  if (failure) throw failure
  if (entries.size === 0) throw archiveRefusal(422, 'archive_empty',
    'The upload is not a Wingfold project archive (no zip entries found).')
  return new Map([...entries].map(([name, parts]) => [name, concatBytes(parts)]))
}

function concatBytes(parts: Uint8Array[]): Uint8Array {
  const out = new Uint8Array(parts.reduce((n, p) => n + p.length, 0))
  let at = 0
  for (const p of parts) { out.set(p, at); at += p.length }
  return out
}
