/**
 * Continuation worker: a thin comlink adapter around FamilyRunner (shared/families), so a family
 * runs off the page's main thread. The page calls `start(doc, settings, Comlink.proxy(onBatch))`,
 * receives batches of points with progress, and may `pause()`, `resume()` or `cancel()`; the
 * promise of `start` resolves with every point computed so far (also after a cancel or a failure).
 * One run at a time per worker.
 */
import { expose } from 'comlink'
import { FamilyRunner, type BatchOptions, type FamilyBatch, type FamilyRunResult } from '../shared/families/runner'
import type { ContinuationStart } from '../shared/continuation/types'
import type { FamilySettingsInput } from '../shared/types/family'
import type { PatternDocument } from '../shared/types/pattern'

/** Creates the API object (exported for tests over a MessageChannel). */
export function createContinuationWorkerApi() {
  let runner: FamilyRunner | undefined
  let running = false
  return {
    /**
     * Runs a family to its end; `onBatch` (wrap it in `Comlink.proxy`) gets each batch.
     * Throws on invalid settings, a document the path does not apply to, or a run in progress.
     * `from` restarts at a stored point (see FamilyRunner).
     */
    async start(doc: PatternDocument, settings: FamilySettingsInput, onBatch: (b: FamilyBatch) => void | Promise<void>, batch?: BatchOptions, from?: ContinuationStart): Promise<FamilyRunResult> {
      if (running) throw new Error('continuation worker: a run is in progress; cancel it first')
      running = true
      try {
        runner = new FamilyRunner(doc, settings, from)
        return await runner.start(onBatch, batch)
      } finally { running = false }
    },
    /** Pause after the current batch. */
    pause(): void { runner?.pause() },
    /** Continue a paused run. */
    resume(): void { runner?.resume() },
    /** End the run; `start` resolves with the points so far. */
    cancel(): void { runner?.cancel() },
    /** The current or last run so far (undefined before the first start). */
    result(): FamilyRunResult | undefined { return runner?.result() },
  }
}

/** The API the worker exposes (every method returns a Promise on the page). */
export type ContinuationWorkerApi = ReturnType<typeof createContinuationWorkerApi>

if (typeof (globalThis as { WorkerGlobalScope?: unknown }).WorkerGlobalScope !== 'undefined') expose(createContinuationWorkerApi())
