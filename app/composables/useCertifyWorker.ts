import { proxy, wrap, type Remote } from 'comlink'
import type { CertifyWorkerApi, DrawingCertificateResult } from '../../workers/certify.worker'
import type { FamilyPointInput, PointCertificate, SegmentCertificate } from '#shared/certify/family'
import type { FamilySettingsInput } from '#shared/types/family'
import type { PatternDocument } from '#shared/types/pattern'

/**
 * One certificate worker (workers/certify.worker.ts) for the calling component, created only in
 * the browser on the first `certify` and terminated when the component unmounts.
 */
export function useCertifyWorker() {
  let worker: Worker | undefined
  let api: Remote<CertifyWorkerApi> | undefined

  function ensure(): Remote<CertifyWorkerApi> {
    if (import.meta.server) throw new Error('useCertifyWorker: workers exist only in the browser')
    if (!api) {
      worker = new Worker(new URL('../../workers/certify.worker.ts', import.meta.url), { type: 'module' })
      api = wrap<CertifyWorkerApi>(worker)
    }
    return api
  }

  /** Certifies the points; `onProgress` receives (done, total) on the main thread after each. */
  function certify(doc: PatternDocument, settings: FamilySettingsInput, points: FamilyPointInput[], onProgress: (done: number, total: number) => void): Promise<PointCertificate[]> {
    return ensure().certify(doc, settings, points, proxy(onProgress))
  }

  /** Certifies the segments between consecutive certified points. */
  function segments(doc: PatternDocument, settings: FamilySettingsInput, points: FamilyPointInput[], certificates: PointCertificate[], onProgress: (done: number, total: number) => void): Promise<SegmentCertificate[]> {
    return ensure().segments(doc, settings, points, certificates, proxy(onProgress))
  }

  /** Certifies one document's drawing and phases, with the certified checklist. */
  function drawing(doc: PatternDocument): Promise<DrawingCertificateResult> {
    return ensure().drawing(doc)
  }

  function terminate() {
    worker?.terminate()
    worker = undefined
    api = undefined
  }
  onBeforeUnmount(terminate)
  return { certify, segments, drawing, cancel: () => api?.cancel(), terminate }
}
