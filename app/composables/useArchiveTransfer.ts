/**
 * Moving project archives with progress: the download is read chunk by chunk (the server streams
 * the zip, so its size is only known at the end: progress is the bytes received so far); the
 * upload goes through XMLHttpRequest, whose upload events give a true fraction.
 */
import type { ArchiveImportResult } from '#shared/types/archive'

/** A refusal of the import route: its message and the names of what failed. */
export interface ArchiveProblem { message: string, problems: string[] }

export function useArchiveTransfer() {
  const received = ref(0)
  const sentFraction = ref(0)
  const busy = ref(false)

  /** Download the project's archive and hand it to the browser as a file. */
  async function download(projectId: number): Promise<void> {
    busy.value = true
    received.value = 0
    try {
      const res = await fetch(`/api/projects/${projectId}/archive`, { credentials: 'same-origin' })
      if (!res.ok || !res.body) throw new Error(((await res.json().catch(() => null)) as { message?: string } | null)?.message ?? `The archive could not be made (HTTP ${res.status}).`)
      const name = /filename="([^"]+)"/.exec(res.headers.get('content-disposition') ?? '')?.[1] ?? `wingfold-project-${projectId}.zip`
      const reader = res.body.getReader()
      const parts: Uint8Array[] = []
      for (;;) {
        const { done, value } = await reader.read()
        if (done) break
        parts.push(value)
        received.value += value.length
      }
      const url = URL.createObjectURL(new Blob(parts as BlobPart[], { type: 'application/zip' }))
      const a = Object.assign(document.createElement('a'), { href: url, download: name })
      document.body.append(a)
      a.click()
      a.remove()
      setTimeout(() => URL.revokeObjectURL(url), 60_000)
    } finally {
      busy.value = false
    }
  }

  /** Upload an archive for import; rejects with an {@link ArchiveProblem}. */
  function upload(file: File): Promise<ArchiveImportResult> {
    busy.value = true
    sentFraction.value = 0
    return new Promise<ArchiveImportResult>((resolve, reject) => {
      const xhr = new XMLHttpRequest()
      xhr.open('POST', '/api/projects/import')
      xhr.setRequestHeader('content-type', 'application/zip')
      xhr.upload.onprogress = (e) => { if (e.lengthComputable) sentFraction.value = e.loaded / e.total }
      xhr.onload = () => {
        let body: { message?: string, data?: { problems?: string[] } } | ArchiveImportResult | null = null
        try { body = JSON.parse(xhr.responseText) } catch { body = null }
        if (xhr.status === 201) resolve(body as ArchiveImportResult)
        else {
          const b = body as { message?: string, data?: { problems?: string[] } } | null
          reject({ message: b?.message ?? `The import failed (HTTP ${xhr.status}).`, problems: b?.data?.problems ?? [] } satisfies ArchiveProblem)
        }
      }
      xhr.onerror = () => reject({ message: 'The upload was interrupted; nothing was imported.', problems: [] } satisfies ArchiveProblem)
      xhr.send(file)
    }).finally(() => { busy.value = false })
  }

  return { received, sentFraction, busy, download, upload }
}

/** Bytes as “12.3 MB” (decimal units). */
export function formatBytes(n: number): string {
  if (n < 1000) return `${n} B`
  if (n < 1e6) return `${(n / 1e3).toFixed(1)} kB`
  return `${(n / 1e6).toFixed(1)} MB`
}
