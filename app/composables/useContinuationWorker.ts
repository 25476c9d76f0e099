import { proxy, wrap, type Remote } from 'comlink'
import type { ContinuationWorkerApi } from '../../workers/continuation.worker'
import type { BatchOptions, FamilyBatch, FamilyRunResult } from '#shared/families/runner'
import type { ContinuationStart } from '#shared/continuation/types'
import type { FamilySettingsInput } from '#shared/types/family'
import type { PatternDocument } from '#shared/types/pattern'

/**
 * One continuation worker (workers/continuation.worker.ts) for the calling component, created
 * only in the browser on the first `start` and terminated when the component unmounts.
 * `terminate()` kills it at once (the run stops where it is; batches already delivered stay delivered).
 */
export function useContinuationWorker() {
  let worker: Worker | undefined
  let api: Remote<ContinuationWorkerApi> | undefined

  function ensure(): Remote<ContinuationWorkerApi> {
    if (import.meta.server) throw new Error('useContinuationWorker: workers exist only in the browser')
    if (!api) {
      worker = new Worker(new URL('../../workers/continuation.worker.ts', import.meta.url), { type: 'module' })
      api = wrap<ContinuationWorkerApi>(worker)
    }
    return api
  }

  /** Runs a family; `onBatch` receives each batch on the main thread. */
  function start(doc: PatternDocument, settings: FamilySettingsInput, onBatch: (b: FamilyBatch) => void | Promise<void>, batch?: BatchOptions, from?: ContinuationStart): Promise<FamilyRunResult> {
    return ensure().start(doc, settings, proxy(onBatch), batch, from)
  }

  function terminate() {
    worker?.terminate()
    worker = undefined
    api = undefined
  }

  onBeforeUnmount(terminate)

  return {
    start,
    pause: () => api?.pause(),
    resume: () => api?.resume(),
    cancel: () => api?.cancel(),
    terminate,
  }
}
