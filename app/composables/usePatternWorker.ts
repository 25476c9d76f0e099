import { wrap, type Remote } from 'comlink'
import type { PatternWorkerApi } from '../../workers/pattern.worker'

let shared: { worker: Worker, api: Remote<PatternWorkerApi> } | undefined

/**
 * The pattern worker (workers/pattern.worker.ts) wrapped with comlink. Created lazily, once per
 * tab, and only in the browser: call `api()` from `onMounted` or an event handler.
 * @returns `api()` giving the remote API; `terminate()` to stop the worker.
 */
export function usePatternWorker() {
  function api(): Remote<PatternWorkerApi> {
    if (import.meta.server) throw new Error('usePatternWorker: workers exist only in the browser')
    if (!shared) {
      const worker = new Worker(new URL('../../workers/pattern.worker.ts', import.meta.url), { type: 'module' })
      shared = { worker, api: wrap<PatternWorkerApi>(worker) }
    }
    return shared.api
  }
  function terminate() {
    shared?.worker.terminate()
    shared = undefined
  }
  return { api, terminate }
}
