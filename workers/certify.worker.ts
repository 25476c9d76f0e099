/**
 * Certificate worker: a thin comlink adapter around certifyFamilyPoints (shared/certify), so
 * interval certificates of a run's points are computed off the page's main thread with progress
 * after each point. `cancel()` stops after the current point; the promise then resolves with the
 * certificates so far. `segments` does the same for the branch between consecutive points;
 * `drawing` certifies one document's drawing and phases and returns the certified checklist.
 */

import { expose } from 'comlink'
import { certifiedExistence, provenParts, type CertifiedExistence } from '../shared/certify/checklist'
import { certifyFamilyPoints, certifyFamilySegments, type FamilyPointInput, type PointCertificate, type SegmentCertificate } from '../shared/certify/family'
import { certifyDrawing, describeCertificate, type DrawingCertificate } from '../shared/certify/pattern'
import { analyzePattern } from '../shared/pattern/analyze'
import { compilePattern } from '../shared/pattern/model'
import type { FamilySettingsInput } from '../shared/types/family'
import type { PatternDocument } from '../shared/types/pattern'

/** A drawing's certificate, its one-line descriptions and the certified checklist of its hypotheses. */
export interface DrawingCertificateResult {
  certificate: DrawingCertificate
  horizontal: string
  phase: string | null
  existence: CertifiedExistence
}

/** Creates the API object (exported for tests over a MessageChannel). */
export function createCertifyWorkerApi() {
  let cancelled = false
  return {
    /** Certifies the points one by one; `onProgress` (a `Comlink.proxy`) gets (done, total) after each. */
    async certify(doc: PatternDocument, settings: FamilySettingsInput, points: FamilyPointInput[], onProgress?: (done: number, total: number) => void | Promise<void>): Promise<PointCertificate[]> {
      cancelled = false
      const out: PointCertificate[] = []
      for (const [k, p] of points.entries()) {
        if (cancelled) break
        out.push(...certifyFamilyPoints(doc, settings, [{ ...p, index: p.index ?? k }]))
        await onProgress?.(k + 1, points.length)
      }
      return out
    },
    /** Certifies the segments between consecutive points whose certificates hold (validated continuation). */
    async segments(doc: PatternDocument, settings: FamilySettingsInput, points: FamilyPointInput[], certificates: PointCertificate[], onProgress?: (done: number, total: number) => void | Promise<void>): Promise<SegmentCertificate[]> {
      cancelled = false
      const out: SegmentCertificate[] = []
      const byIndex = new Map(certificates.map(c => [c.index, c]))
      const sorted = [...points].sort((a, b) => (a.index ?? 0) - (b.index ?? 0))
      for (let k = 0; k + 1 < sorted.length && !cancelled; k++) {
        const pair = [sorted[k]!, sorted[k + 1]!]
        out.push(...certifyFamilySegments(doc, settings, pair, pair.flatMap(p => byIndex.get(p.index ?? -1) ?? [])))
        await onProgress?.(k + 1, sorted.length - 1)
      }
      return out
    },
    /** Certifies the document's own drawing (and phases when it has them) with the checklist. */
    async drawing(doc: PatternDocument): Promise<DrawingCertificateResult> {
      const certificate = certifyDrawing(compilePattern(doc), doc.phases !== undefined)
      return {
        certificate,
        horizontal: describeCertificate(certificate.horizontal),
        phase: certificate.phase ? describeCertificate(certificate.phase) : null,
        existence: certifiedExistence(analyzePattern(doc).existence, provenParts(certificate)),
      }
    },
    /** Stop after the current point. */
    cancel(): void { cancelled = true },
  }
}

/** The API the worker exposes (every method returns a Promise on the page). */
export type CertifyWorkerApi = ReturnType<typeof createCertifyWorkerApi>

if (typeof (globalThis as { WorkerGlobalScope?: unknown }).WorkerGlobalScope !== 'undefined') expose(createCertifyWorkerApi())
