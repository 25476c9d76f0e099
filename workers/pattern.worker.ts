/**
 * Pattern worker: a thin comlink adapter around the pure core in shared/, so analysis runs off
 * the page's main thread. Reached from pages through app/composables/usePatternWorker.ts.
 */
import { expose } from 'comlink'
import { safeParsePatternDocument, type PatternIssue, type PatternDocument } from '../shared/types/pattern'
import { analyzePattern, type AnalyzeOptions } from '../shared/pattern/analyze'
import type { PatternReport } from '../shared/pattern/report'

/** The API the worker exposes (wrapped by comlink: every method returns a Promise on the page). */
export const patternWorkerApi = {
  /** Liveness check: answers from inside the worker. */
  ping(): { ok: true, inWorker: boolean } {
    return { ok: true, inWorker: typeof (globalThis as { WorkerGlobalScope?: unknown }).WorkerGlobalScope !== 'undefined' }
  },
  /** Parse a JSON text as a pattern document: the document, or the issues with their JSON paths. */
  parse(json: string): { success: true, data: PatternDocument } | { success: false, issues: PatternIssue[] } {
    let value: unknown
    try { value = JSON.parse(json) }
    catch (e) { return { success: false, issues: [{ path: '', message: `not JSON: ${(e as Error).message}` }] } }
    return safeParsePatternDocument(value)
  },
  /** Analyse a parsed document (`analyzePattern` of the core); throws on an invalid document. */
  analyze(doc: PatternDocument, options?: AnalyzeOptions): PatternReport {
    return analyzePattern(doc, options)
  },
}

export type PatternWorkerApi = typeof patternWorkerApi

expose(patternWorkerApi)
