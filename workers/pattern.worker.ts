/**
 * Pattern worker: a thin comlink adapter around the pure core in shared/, so analysis runs off
 * the page's main thread. Reached from pages through app/composables/usePatternWorker.ts.
 */
import { expose } from 'comlink'
import { safeParsePatternDocument, type PatternIssue, type PatternDocument } from '../shared/types/pattern'
import { analyzePattern, type AnalyzeOptions } from '../shared/pattern/analyze'
import type { PatternReport } from '../shared/pattern/report'
import { balancePattern, type BalanceOptions, type BalancePatternResult } from '../shared/pattern/balance-solve'
import { compilePattern } from '../shared/pattern/model'
import { solvePhases, type PhaseSolveOptions } from '../shared/pattern/phase-solve'

/** Result of the worker's phase solve: vertex phases by id plus the solve data. */
export interface PhaseSolveOutcome {
  converged: boolean
  iterations: number
  residualNorm: number
  vertexPhases: Record<string, number>
  reason?: string
}

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
  /**
   * Check then analyse a document being edited: the parser's issues when it is not a valid
   * document yet (e.g. no vertex), the report otherwise; the analysis time is measured here.
   */
  inspect(doc: unknown, options?: AnalyzeOptions):
    { ok: true, report: PatternReport, ms: number } | { ok: false, issues: PatternIssue[] } {
    const parsed = safeParsePatternDocument(doc)
    if (!parsed.success) return { ok: false, issues: parsed.issues }
    const t0 = performance.now()
    const report = analyzePattern(parsed.data, options)
    return { ok: true, report, ms: performance.now() - t0 }
  },
  /** Balance solve (`balancePattern` of the core): the document with balanced positions. */
  balance(doc: PatternDocument, options?: BalanceOptions): BalancePatternResult {
    return balancePattern(doc, options)
  },
  /** Phase solve G(ψ) = 0 with α and the edge weights of the document fixed (vertex 0 pinned). */
  solvePhases(doc: PatternDocument, options?: PhaseSolveOptions): PhaseSolveOutcome {
    const m = compilePattern(doc)
    const weights = new Float64Array(doc.edges.map(e => e.weight ?? 1))
    const r = solvePhases(m, m.psi, doc.phases?.alpha ?? [0, 0], weights, options)
    const vertexPhases = Object.fromEntries(doc.vertices.map((v, i) => [v.id, r.psi[i]!]))
    return { converged: r.converged, iterations: r.iterations, residualNorm: r.residualNorm, vertexPhases, ...(r.reason ? { reason: r.reason } : {}) }
  },
}

export type PatternWorkerApi = typeof patternWorkerApi

expose(patternWorkerApi)
